import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { findFreePort } from './server';

export interface ReceivedMail {
  to: string;
  subject: string;
  text: string;
  messageId?: string;
}

/** A local fake mail server speaking real SMTP, for the server under test to deliver to. */
export class SmtpFake {
  readonly received: ReceivedMail[] = [];
  private server?: SMTPServer;

  constructor(readonly port: number) {}

  static async create(): Promise<SmtpFake> {
    return new SmtpFake(await findFreePort());
  }

  start(): Promise<void> {
    this.server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      onData: (stream, _session, callback) => {
        simpleParser(stream)
          .then((mail) => {
            const to = Array.isArray(mail.to) ? mail.to.map((a) => a.text).join(', ') : (mail.to?.text ?? '');
            this.received.push({ to, subject: mail.subject ?? '', text: mail.text ?? '', messageId: mail.messageId });
            callback();
          })
          .catch(callback);
      },
    });
    // A sender stopped mid-conversation (a test stopping its server) resets its connection; a real mail
    // server drops that connection and goes on, and so does this one.
    this.server.on('error', () => undefined);
    return new Promise((resolve) => this.server!.listen(this.port, '127.0.0.1', () => resolve()));
  }

  stop(): Promise<void> {
    return new Promise((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }

  /** Waits for a message matching `predicate`; throws after `timeoutMs`. */
  async waitFor(predicate: (mail: ReceivedMail) => boolean, timeoutMs = 15_000): Promise<ReceivedMail> {
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline) {
      const found = this.received.find(predicate);
      if (found) return found;
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(
      `no matching mail within ${timeoutMs} ms; received: ${JSON.stringify(this.received.map((m) => m.subject))}`,
    );
  }
}
