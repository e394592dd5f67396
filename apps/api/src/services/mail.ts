import nodemailer, { type Transporter } from 'nodemailer';
import type { Models, OutboxRow } from '../models/index.js';
import { iso } from './dto.js';

export interface OutboxDto {
  id: string;
  to: string;
  subject: string;
  text: string;
  status: 'saved' | 'sent' | 'failed';
  error: string | null;
  createdAt: string;
}

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  /** Parts of `text` (one-time links) that must not stay in the outbox once mail left by SMTP. */
  secrets?: string[];
}

/**
 * E-mail through nodemailer. Without SMTP_URL the JSON transport renders each message and
 * the outbox table is the mailbox (development and tests; admins read it through the API).
 * With SMTP_URL the message is delivered and the outbox keeps a copy with one-time links
 * redacted, plus the delivery state.
 */
export class Mailer {
  private readonly transport: Transporter;
  private readonly local: boolean;

  constructor(
    private readonly models: Models,
    smtpUrl: string,
    private readonly from: string,
  ) {
    this.local = smtpUrl === '';
    this.transport = this.local ? nodemailer.createTransport({ jsonTransport: true }) : nodemailer.createTransport(smtpUrl);
  }

  async send(message: MailMessage): Promise<void> {
    const envelope = { from: this.from, to: message.to, subject: message.subject, text: message.text };
    if (this.local) {
      const info = (await this.transport.sendMail(envelope)) as { message: string };
      await this.models.Outbox.create({ ...envelope, message: String(info.message), status: 'saved' });
      return;
    }
    let redacted = message.text;
    for (const secret of message.secrets ?? []) redacted = redacted.split(secret).join('[redacted]');
    const copy = { ...envelope, text: redacted };
    try {
      await this.transport.sendMail(envelope);
      await this.models.Outbox.create({ ...copy, message: JSON.stringify(copy), status: 'sent' });
    } catch (error) {
      await this.models.Outbox.create({
        ...copy,
        message: JSON.stringify(copy),
        status: 'failed',
        error: error instanceof Error ? error.message : String(error),
      });
    }
  }

  async list(limit: number, offset: number): Promise<OutboxDto[]> {
    const rows = await this.models.Outbox.findAll({ order: [['createdAt', 'DESC']], limit, offset });
    return rows.map(toDto);
  }

  close(): void {
    this.transport.close();
  }
}

function toDto(row: OutboxRow): OutboxDto {
  return {
    id: row.id,
    to: row.to,
    subject: row.subject,
    text: row.text,
    status: row.status,
    error: row.error,
    createdAt: iso(row.createdAt),
  };
}
