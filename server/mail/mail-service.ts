import nodemailer, { type Transporter } from 'nodemailer';
import type { Db } from '../db/connection';
import { startFakeSmtp } from './fake-smtp';
import { insertOutbox, listOutbox } from './outbox-repository';

export interface Mail {
  to: string[];
  subject: string;
  text: string;
}

export class MailService {
  private pending = new Set<Promise<void>>();

  private constructor(
    private readonly db: Db,
    private readonly transport: Transporter,
    private readonly from: string,
    /** True when the fake SMTP server records the outbox itself. */
    private readonly fake: boolean,
    private readonly stopFake: () => Promise<void>,
    private readonly log: (msg: string, err?: unknown) => void,
  ) {}

  /** With `smtpUrl` unset, starts an in-process SMTP server on loopback that keeps every message in the outbox. */
  static async create(db: Db, opts: { smtpUrl?: string; from: string; log: (msg: string, err?: unknown) => void }) {
    if (opts.smtpUrl) {
      return new MailService(db, nodemailer.createTransport(opts.smtpUrl), opts.from, false, async () => {}, opts.log);
    }
    const fake = await startFakeSmtp((m) => insertOutbox(db, m));
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: fake.port, secure: false, ignoreTLS: true });
    return new MailService(db, transport, opts.from, true, fake.close, opts.log);
  }

  /** Sends now; rejects if the mail server refuses. */
  async send(mail: Mail): Promise<void> {
    if (mail.to.length === 0) return;
    await this.transport.sendMail({ from: this.from, to: mail.to, subject: mail.subject, text: mail.text });
    if (!this.fake) insertOutbox(this.db, { sender: this.from, recipients: mail.to, subject: mail.subject, text: mail.text });
  }

  /** Sends in the background (notifications); a failure is logged, never thrown. */
  notify(mail: Mail): void {
    const p = this.send(mail).catch((e) => this.log(`mail to ${mail.to.join(', ')} failed`, e));
    this.pending.add(p);
    void p.finally(() => this.pending.delete(p));
  }

  /** Resolves when every background message has been handed over. */
  async flush(): Promise<void> {
    while (this.pending.size) await Promise.all([...this.pending]);
  }

  outbox(limit = 100) {
    return listOutbox(this.db, limit);
  }

  async close(): Promise<void> {
    await this.flush();
    this.transport.close();
    await this.stopFake();
  }
}
