import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import { readEnvironment, usesMailCatcher } from '../../environment';

/**
 * A local fake mail server for development and the demo: when no SMTP_HOST is set, Lashline
 * catches its own mail on 127.0.0.1:SMTP_PORT. Real SMTP, real parsing. /dev/mail lists it all under
 * `astro dev`; a built server lists it only with MAIL_CATCHER_PAGE=on, to owners, their own team's mail
 * (`caught-mail.ts`).
 */

export interface CaughtMail {
  id: number;
  at: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  /** As the sender set it; the outbox makes it from its row (`<row-id@outbox.lashline>`). */
  messageId: string;
}

const caught: CaughtMail[] = [];
let started: Promise<void> | undefined;
let nextId = 1;
let listeningPort: number | undefined;

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
              messageId: mail.messageId ?? '',
            });
            caught.splice(200);
            callback();
          })
          .catch((error: Error) => callback(error));
      },
    });
    const listen = (port: number) => server.listen(port, '127.0.0.1');
    server.server.on('listening', () => {
      const address = server.server.address();
      listeningPort = typeof address === 'object' && address ? address.port : env.SMTP_PORT;
      console.log(`[lashline] mail catcher: catching this process's mail on 127.0.0.1:${listeningPort}`);
      resolve();
    });
    server.on('error', (error: NodeJS.ErrnoException) => {
      // Another process (a second server on this machine) holds the port: this one catches its own mail
      // on a port of its own rather than handing it to the other's catcher.
      if (error.code === 'EADDRINUSE' && listeningPort === undefined) {
        console.warn(`[lashline] mail catcher: 127.0.0.1:${env.SMTP_PORT} is in use; choosing a free port.`);
        listen(0);
        return;
      }
      console.warn(`[lashline] mail catcher: ${error.message}`);
    });
    listen(env.SMTP_PORT);
  });
  return started;
}

/** The port this process's catcher listens on, once started (the mailer sends there). */
export function catcherPort(): number | undefined {
  return listeningPort;
}

/** The mail caught so far, newest first. */
export function listCaughtMail(): readonly CaughtMail[] {
  return caught;
}
