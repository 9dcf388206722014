import { type DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_PIPE } from '@nestjs/core';
import { LoggerModule } from 'nestjs-pino';
import { ZodValidationPipe } from 'nestjs-zod';
import { AllExceptionsFilter } from './common/all-exceptions.filter.js';
import { ConfigModule } from './config/config.module.js';
import type { AppConfig } from './config/config.js';
import { AuthCoreModule } from './auth/auth-core.module.js';
import { DbModule } from './db/db.module.js';
import { HealthModule } from './health/health.module.js';
import { AuthModule } from './auth/auth.module.js';
import { MailModule } from './mail/mail.module.js';
import { RateLimitModule } from './rate-limit/rate-limit.module.js';
import { UsersModule } from './users/users.module.js';
import { PhotosModule } from './photos/photos.module.js';
import { AuditModule } from './audit/audit.module.js';
import { SitesModule } from './sites/sites.module.js';
import { ScaffoldsModule } from './scaffolds/scaffolds.module.js';
import { InspectionsModule } from './inspections/inspections.module.js';
import { FindingsModule } from './findings/findings.module.js';
import { CatalogueModule } from './catalogue/catalogue.module.js';
import { SyncModule } from './sync/sync.module.js';
import { OrganisationsModule } from './organisations/organisations.module.js';
import { HousekeepingModule } from './housekeeping/housekeeping.module.js';
import { OverviewModule } from './overview/overview.module.js';
import { TrendsModule } from './trends/trends.module.js';
import { ScaffoldReportsModule } from './scaffold-reports/scaffold-reports.module.js';
import { ReportsModule } from './reports/reports.module.js';
import { RegisterModule } from './register/register.module.js';

/** Feature modules are listed here once each. */
const FEATURES = [
  HealthModule,
  RateLimitModule,
  MailModule,
  UsersModule,
  AuthModule,
  PhotosModule,
  AuditModule,
  SitesModule,
  ScaffoldsModule,
  InspectionsModule,
  FindingsModule,
  CatalogueModule,
  SyncModule,
  OrganisationsModule,
  HousekeepingModule,
  OverviewModule,
  TrendsModule,
  ScaffoldReportsModule,
  ReportsModule,
  RegisterModule,
];

@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(config),
        LoggerModule.forRoot({
          pinoHttp: {
            level: config.LOG_LEVEL,
            redact: ['req.headers.authorization', 'req.headers.cookie'],
            // One compact line per request: no headers, bodies or tokens in the log.
            serializers: {
              req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url }),
              res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
            },
            autoLogging: { ignore: (req) => req.url === '/api/health' },
          },
        }),
        DbModule,
        AuthCoreModule,
        ...FEATURES,
      ],
      providers: [
        { provide: APP_PIPE, useClass: ZodValidationPipe },
        { provide: APP_FILTER, useClass: AllExceptionsFilter },
      ],
    };
  }
}
