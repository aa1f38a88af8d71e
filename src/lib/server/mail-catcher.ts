import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { readEnvironment, usesMailCatcher } from '../../environment';

/**
 * A local fake mail server for development and the demo: when no SMTP_HOST is set, Lashline
 * catches its own mail on 127.0.0.1:SMTP_PORT and lists it at /dev/mail. Real SMTP, real parsing.
 */

export interface CaughtMail {
  id: number;
  at: string;
  from: string;
  to: string;
  subject: string;
  text: string;
}

const caught: CaughtMail[] = [];
let started: Promise<void> | undefined;
let nextId = 1;

/** Starts the catcher once, when the environment asks for it. */
export function startMailCatcher(): Promise<void> {
  const env = readEnvironment();
  if (!usesMailCatcher(env)) return Promise.resolve();
  started ??= new Promise((resolve) => {
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS', 'AUTH'],
      onData(stream, _session, callback) {
        simpleParser(stream)
          .then((mail) => {
            caught.unshift({
              id: nextId++,
              at: new Date().toISOString(),
              from: mail.from?.text ?? '',
              to: Array.isArray(mail.to) ? mail.to.map((a) => a.text).join(', ') : (mail.to?.text ?? ''),
              subject: mail.subject ?? '',
              text: mail.text ?? '',
            });
            caught.splice(200);
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    server.on('error', (error) => {
      console.warn(`[lashline] mail catcher: ${error.message}`);
      resolve();
    });
    server.listen(env.SMTP_PORT, '127.0.0.1', () => resolve());
  });
  return started;
}

/** The mail caught so far, newest first. */
export function listCaughtMail(): readonly CaughtMail[] {
  return caught;
}
