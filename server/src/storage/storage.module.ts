import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { S3Client } from '@aws-sdk/client-s3';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { ObjectStorage } from './object-storage.service.js';
import { S3_CLIENT } from './storage.tokens.js';

/**
 * Object storage through the S3 API: s3rver locally and in tests, any S3-compatible store in
 * production (S3_ENDPOINT unset means AWS itself). Global: import it once, from any feature.
 */
@Global()
@Module({
  providers: [
    {
      provide: S3_CLIENT,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) =>
        new S3Client({
          endpoint: config.S3_ENDPOINT,
          region: config.S3_REGION,
          forcePathStyle: config.S3_FORCE_PATH_STYLE,
          credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
          // Extra CRC checksums are only sent when the operation needs them: several
          // S3-compatible stores (and s3rver) do not know the newer checksum headers.
          requestChecksumCalculation: 'WHEN_REQUIRED',
          responseChecksumValidation: 'WHEN_REQUIRED',
          maxAttempts: 3,
          // Without these a store that accepts the connection and never answers holds the request for ever.
          requestHandler: { connectionTimeout: config.S3_CONNECT_TIMEOUT_MS, requestTimeout: config.S3_REQUEST_TIMEOUT_MS, throwOnRequestTimeout: true },
        }),
    },
    ObjectStorage,
  ],
  exports: [S3_CLIENT, ObjectStorage],
})
export class StorageModule implements OnApplicationShutdown {
  constructor(@Inject(S3_CLIENT) private readonly s3: S3Client) {}

  onApplicationShutdown(): void {
    this.s3.destroy();
  }
}
