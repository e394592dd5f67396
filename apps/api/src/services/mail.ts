import { randomUUID } from 'node:crypto';
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
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
  /** The team whose admins see the outbox copy; null for mail that belongs to no team. */
  teamId: string | null;
  /** Parts of `text` (one-time tokens) that only the delivered message may hold. */
  secrets?: string[];
}

/** A message as the local transport delivered it (read back by {@link readMailDrop}). */
export interface DeliveredMail {
  file: string;
  to: string;
  subject: string;
  text: string;
}

/**
 * Bearer secrets of every kind (one-time `pwt_`, session `pws_`, key `pwk_`) as they would
 * appear in a mail body; masked in the outbox even when a caller forgot to list them.
 */
const LIVE_SECRET = /pw[tsk]_[A-Za-z0-9_-]{16,}/g;

/** `pwt_[hidden]`: keeps the kind of secret visible, nothing of its value. */
export function maskSecret(secret: string): string {
  return `${secret.slice(0, 4)}[hidden]`;
}

/** The outbox copy of a text: every listed secret and anything shaped like one masked. */
export function maskSecrets(text: string, secrets: readonly string[] = []): string {
  let masked = text;
  for (const secret of secrets) if (secret) masked = masked.split(secret).join(maskSecret(secret));
  return masked.replace(LIVE_SECRET, maskSecret);
}

/**
 * E-mail through nodemailer. With SMTP_URL the message is delivered by SMTP. Without it the
 * local transport delivers each message as an .eml file into `mailDir` (development and tests:
 * open it with any mail client, or read it back with {@link readMailDrop}). Either way the
 * outbox table keeps a copy for the team's admins with every secret masked, so a one-time link
 * works only in the message actually delivered, and reading the outbox gives no one access.
 */
export class Mailer {
  private readonly transport: Transporter;
  private readonly local: boolean;

  constructor(
    private readonly models: Models,
    smtpUrl: string,
    private readonly from: string,
    private readonly mailDir: string,
  ) {
    this.local = smtpUrl === '';
    this.transport = this.local
      ? nodemailer.createTransport({ streamTransport: true, buffer: true, newline: 'unix' })
      : nodemailer.createTransport(smtpUrl);
  }

  async send(message: MailMessage): Promise<void> {
    const envelope = {
      from: this.from,
      to: message.to,
      subject: message.subject,
      text: message.text,
    };
    const copy = { ...envelope, text: maskSecrets(message.text, message.secrets) };
    const id = randomUUID();
    let status: OutboxRow['status'] = this.local ? 'saved' : 'sent';
    let error: string | null = null;
    try {
      const info = (await this.transport.sendMail(envelope)) as { message?: unknown };
      if (this.local) this.drop(id, info.message);
    } catch (failure) {
      status = 'failed';
      error = failure instanceof Error ? failure.message : String(failure);
    }
    await this.models.Outbox.create({
      id,
      teamId: message.teamId,
      ...copy,
      message: JSON.stringify(copy),
      status,
      error,
    });
  }

  /** Writes one delivered message into the mail drop, readable by its owner only. */
  private drop(id: string, rendered: unknown): void {
    mkdirSync(this.mailDir, { recursive: true, mode: 0o700 });
    const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${id}.eml`;
    writeFileSync(
      path.join(this.mailDir, name),
      Buffer.isBuffer(rendered) ? rendered : String(rendered),
      { mode: 0o600 },
    );
  }

  /** The team's mail, newest first, secrets masked. */
  async list(teamId: string, limit: number, offset: number): Promise<OutboxDto[]> {
    const rows = await this.models.Outbox.findAll({
      where: { teamId },
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit,
      offset,
    });
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

/**
 * Reads back the messages the local transport delivered into `mailDir`, oldest first: what a
 * mail client would show of our plain-text messages (RFC 5322 headers, a quoted-printable,
 * base64 or 7-bit body). For development and tests; a missing folder holds no mail.
 */
export function readMailDrop(mailDir: string): DeliveredMail[] {
  let names: string[];
  try {
    names = readdirSync(mailDir).filter((name) => name.endsWith('.eml'));
  } catch {
    return [];
  }
  return names.sort().map((name) => {
    const source = readFileSync(path.join(mailDir, name), 'utf8').replace(/\r\n/g, '\n');
    const split = source.indexOf('\n\n');
    const head = (split < 0 ? source : source.slice(0, split)).replace(/\n[ \t]+/g, ' ');
    const body = split < 0 ? '' : source.slice(split + 2);
    const header = (field: string): string =>
      new RegExp(`^${field}:[ \\t]*(.*)$`, 'im').exec(head)?.[1]?.trim() ?? '';
    const encoding = header('Content-Transfer-Encoding').toLowerCase();
    const text =
      encoding === 'quoted-printable'
        ? decodeQuotedPrintable(body)
        : encoding === 'base64'
          ? Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8')
          : body;
    return { file: name, to: header('To'), subject: decodeWords(header('Subject')), text };
  });
}

/** RFC 2045 §6.7 quoted-printable: soft line breaks removed, `=XX` octets decoded as UTF-8. */
function decodeQuotedPrintable(body: string): string {
  const joined = body.replace(/=\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else bytes.push(...Buffer.from(joined[i] as string, 'utf8'));
  }
  return Buffer.from(bytes).toString('utf8');
}

/** RFC 2047 encoded words (`=?UTF-8?Q?…?=`, `=?UTF-8?B?…?=`) in a header. */
function decodeWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(
      /=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g,
      (_all, _charset: string, kind: string, data: string) =>
        kind.toUpperCase() === 'B'
          ? Buffer.from(data, 'base64').toString('utf8')
          : decodeQuotedPrintable(data.replace(/_/g, ' ')),
    );
}
