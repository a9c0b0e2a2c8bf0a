import { createTransport, type Transporter } from 'nodemailer';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';

import type { MailConfig } from '../config';
import { OutboxMessage, type OutboxStatus } from './outbox-message.entity';
import type { RenderedMail } from './templates/layout';

export interface Envelope {
  readonly to: string;
  /** The account the message is about, for the outbox. */
  readonly userId?: string | null;
  /** Values (tokens) replaced by "[link removed]" in the outbox copy; the recipient gets them intact. */
  readonly secrets?: readonly string[];
}

/** SMTP transport from configuration: the local mail catcher in development and tests. */
export function smtpTransport(mail: MailConfig): Transporter {
  return createTransport({
    host: mail.host,
    port: mail.port,
    secure: mail.secure,
    auth: mail.user ? { user: mail.user, pass: mail.pass ?? '' } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
}

/**
 * The one way Flowlore sends e-mail. Every message is recorded in the outbox, sent or failed:
 * a failed send never loses its record. Later issues (invitations, receipts, graded work) reuse it.
 */
export class Mailer {
  private readonly inFlight = new Set<Promise<unknown>>();

  constructor(
    private readonly transport: Transporter,
    private readonly from: string,
    private readonly dataSource: DataSource,
    private readonly logger: Logger,
  ) {}

  async send(envelope: Envelope, mail: RenderedMail): Promise<OutboxStatus> {
    let status: OutboxStatus = 'sent';
    let error: string | null = null;
    try {
      await this.transport.sendMail({ from: this.from, to: envelope.to, subject: mail.subject, text: mail.text, html: mail.html });
    } catch (err) {
      status = 'failed';
      error = err instanceof Error ? err.message : String(err);
      this.logger.warn({ template: mail.template, error }, 'e-mail not sent');
    }
    const redact = (body: string) => (envelope.secrets ?? []).reduce((text, secret) => text.split(secret).join('[link removed]'), body);
    await this.dataSource.getRepository(OutboxMessage).insert({
      toAddress: envelope.to,
      subject: mail.subject.slice(0, 200),
      template: mail.template,
      textBody: redact(mail.text),
      htmlBody: redact(mail.html),
      status,
      error,
      sentAt: status === 'sent' ? new Date() : null,
      userId: envelope.userId ?? null,
    });
    return status;
  }

  /**
   * Sends without making the caller wait, so an answer takes as long whether or not a message went
   * out (no hint that an address is registered). Errors are logged; the outbox still gets its row.
   */
  sendInBackground(envelope: Envelope, mail: RenderedMail): void {
    const job = this.send(envelope, mail).catch((err: unknown) => this.logger.error({ err, template: mail.template }, 'recording an e-mail failed'));
    this.inFlight.add(job);
    void job.finally(() => this.inFlight.delete(job));
  }

  /** Resolves when every background send has finished (shutdown, tests). */
  async idle(): Promise<void> {
    while (this.inFlight.size) await Promise.allSettled([...this.inFlight]);
  }
}
