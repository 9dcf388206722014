import type { Readable } from 'node:stream';
import { Inject, Injectable, Logger } from '@nestjs/common';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { S3_CLIENT } from './storage.tokens.js';

export interface StoredObject {
  body: Readable;
  contentLength?: number;
  contentType?: string;
}

function isNotFound(error: unknown): boolean {
  if (!(error instanceof S3ServiceException)) return false;
  return error.$metadata?.httpStatusCode === 404 || error.name === 'NotFound' || error.name === 'NoSuchKey';
}

/** A conditional PUT that lost: the key was written meanwhile (412), or by a write in flight (409). */
function isAlreadyThere(error: unknown): boolean {
  if (!(error instanceof S3ServiceException)) return false;
  const status = error.$metadata?.httpStatusCode;
  return status === 412 || (status === 409 && error.name === 'ConditionalRequestConflict');
}

/**
 * The one bucket of the deployment, by key. Keys are chosen by the caller (content-addressed for
 * photos), so writing the same key twice with the same bytes is harmless. Store failures become
 * 503 SERVICE_UNAVAILABLE: the client retries later, nothing half-written is kept in PostgreSQL.
 */
@Injectable()
export class ObjectStorage {
  private readonly logger = new Logger(ObjectStorage.name);
  private readonly bucket: string;

  constructor(
    @Inject(S3_CLIENT) private readonly s3: S3Client,
    @Inject(APP_CONFIG) config: AppConfig,
  ) {
    this.bucket = config.S3_BUCKET;
  }

  /** Resolves when the bucket answers (health check); one attempt, no retries. */
  async ping(): Promise<void> {
    await this.s3.send(new HeadBucketCommand({ Bucket: this.bucket }), { abortSignal: AbortSignal.timeout(2_000) });
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.s3.send(new HeadObjectCommand({ Bucket: this.bucket, Key: key }));
      return true;
    } catch (error) {
      if (isNotFound(error)) return false;
      throw this.unavailable('head', key, error);
    }
  }

  /**
   * Stores `body` under `key` unless an object is there already (HeadObject first, then a PUT with
   * `If-None-Match: *` where the store supports it). Returns whether this call wrote it.
   */
  async putIfAbsent(key: string, body: Buffer, contentType: string): Promise<'stored' | 'existed'> {
    if (await this.exists(key)) return 'existed';
    try {
      await this.s3.send(
        new PutObjectCommand({
          Bucket: this.bucket,
          Key: key,
          Body: body,
          ContentType: contentType,
          ContentLength: body.length,
          IfNoneMatch: '*',
        }),
      );
      return 'stored';
    } catch (error) {
      if (isAlreadyThere(error)) return 'existed';
      throw this.unavailable('put', key, error);
    }
  }

  /** The object's bytes as a stream, or undefined when there is no such key. */
  async get(key: string): Promise<StoredObject | undefined> {
    try {
      const out = await this.s3.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      return { body: out.Body as Readable, contentLength: out.ContentLength, contentType: out.ContentType };
    } catch (error) {
      if (isNotFound(error)) return undefined;
      throw this.unavailable('get', key, error);
    }
  }

  async remove(key: string): Promise<void> {
    try {
      await this.s3.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key }));
    } catch (error) {
      if (isNotFound(error)) return;
      throw this.unavailable('delete', key, error);
    }
  }

  /** Every key under a prefix (for maintenance and tests; pages through the whole listing). */
  async listKeys(prefix: string): Promise<string[]> {
    const keys: string[] = [];
    let token: string | undefined;
    try {
      do {
        const page = await this.s3.send(
          new ListObjectsV2Command({ Bucket: this.bucket, Prefix: prefix, ContinuationToken: token }),
        );
        for (const o of page.Contents ?? []) if (o.Key) keys.push(o.Key);
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    } catch (error) {
      throw this.unavailable('list', prefix, error);
    }
    return keys;
  }

  private unavailable(operation: string, key: string, error: unknown): AppError {
    this.logger.error(`object storage ${operation} ${key} failed: ${error instanceof Error ? error.message : String(error)}`);
    return new AppError(ErrorCode.ServiceUnavailable, 'Photo storage is unavailable; try again shortly');
  }
}
