import nodemailer, { type Transporter } from 'nodemailer';
import type { JobRunner } from '../jobs/runner';

export type OutgoingMail = { to: string; subject: string; text: string; html: string };

export type Mailer = {
  /** Queue a mail in the outbox; it is sent by the job runner and retried while the SMTP server is down. */
  queue(mail: OutgoingMail, opts?: { dedupeKey?: string; db?: Parameters<JobRunner['enqueue']>[3] }): void;
};

export const MAIL_JOB = 'mail.send';

export function createSmtpTransport(opts: { host: string; port: number } | { url: string }): Transporter {
  if ('url' in opts) return nodemailer.createTransport(opts.url);
  // The local mail catcher speaks plain SMTP on loopback; no TLS upgrade, short timeouts so a
  // stopped catcher fails the job quickly and the runner retries it later.
  return nodemailer.createTransport({
    host: opts.host,
    port: opts.port,
    secure: false,
    ignoreTLS: true,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
    socketTimeout: 10_000,
  });
}

export function createMailer(jobs: JobRunner, transport: Transporter, from: string): Mailer {
  jobs.register(MAIL_JOB, async (mail: OutgoingMail) => {
    await transport.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
  });
  return {
    queue(mail, opts = {}) {
      jobs.enqueue(MAIL_JOB, mail, { dedupeKey: opts.dedupeKey, maxAttempts: 20 }, opts.db);
    },
  };
}
