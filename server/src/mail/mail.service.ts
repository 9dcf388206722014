import { Inject, Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { type MailContent, renderMail } from './mail.layout.js';

/** Names the organisation a message belongs to, so the development mail viewer can keep organisations apart. */
export const ORGANISATION_HEADER = 'X-Plummet-Organisation';

export interface OutgoingMessage {
  organisationId: string;
  to: string[];
  cc?: string[];
  subject: string;
  text: string;
  html: string;
  attachments?: { filename?: string; content: Buffer; contentType: string; cid?: string; contentDisposition?: 'inline' | 'attachment' }[];
}

function isLoopback(host: string): boolean {
  return host === 'localhost' || host === '::1' || host.startsWith('127.');
}

/** Sends e-mail over SMTP (the local fake in development and tests); every message carries the caution footer. */
@Injectable()
export class MailService implements OnModuleDestroy {
  private readonly logger = new Logger(MailService.name);
  private readonly transport: Transporter;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {
    this.transport = nodemailer.createTransport({
      host: config.SMTP_HOST,
      port: config.SMTP_PORT,
      secure: false,
      // The loopback fake speaks plain SMTP; anything else upgrades with STARTTLS when offered.
      ignoreTLS: isLoopback(config.SMTP_HOST),
      connectionTimeout: config.SMTP_CONNECT_TIMEOUT_MS,
      greetingTimeout: config.SMTP_CONNECT_TIMEOUT_MS,
      socketTimeout: config.SMTP_SOCKET_TIMEOUT_MS,
    });
  }

  /** Sends one message; 503 SERVICE_UNAVAILABLE when the mail server cannot be reached. */
  async send(to: string, content: MailContent, organisationId?: string): Promise<void> {
    const { text, html } = renderMail(content);
    const headers = organisationId ? { [ORGANISATION_HEADER]: organisationId } : undefined;
    try {
      await this.transport.sendMail({ from: this.config.MAIL_FROM, to, subject: content.subject, text, html, headers });
    } catch (error) {
      this.logger.error(`sending "${content.subject}" failed: ${error instanceof Error ? error.message : String(error)}`);
      throw new AppError(ErrorCode.ServiceUnavailable, 'The e-mail could not be sent; try again later');
    }
  }

  /**
   * Sends one message with attachments (inline images by cid) to several recipients in a single
   * SMTP transaction. Errors are thrown as they are, so a queued job fails and is retried.
   */
  async sendMessage(message: OutgoingMessage): Promise<void> {
    const { organisationId, ...rest } = message;
    await this.transport.sendMail({ from: this.config.MAIL_FROM, ...rest, headers: { [ORGANISATION_HEADER]: organisationId } });
  }

  onModuleDestroy(): void {
    this.transport.close();
  }
}
