import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import type { Db } from '../../db/database';
import { parseMail } from './mail-reader';

/** Largest message the local service accepts; app mail is a few kilobytes. */
const MAX_MESSAGE_BYTES = 1024 * 1024;

export interface LocalMailServer {
  host: string;
  port: number;
  close: () => Promise<void>;
}

/**
 * The local fake mail service: a real SMTP server (smtp-server) on 127.0.0.1 and a random free port
 * that stores every message it receives in mailbox_message, so mail can be read in the Mailbox page
 * without any outside server. No authentication and no TLS: it only listens on the loopback address.
 */
export async function startLocalMailServer(db: Db, log: (message: string) => void): Promise<LocalMailServer> {
  const host = '127.0.0.1';
  const server = new SMTPServer({
    name: 'epsigma.local',
    banner: 'Epsigma local mailbox',
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    disableReverseLookup: true,
    size: MAX_MESSAGE_BYTES,
    logger: false,
    closeTimeout: 2000,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', (err) => callback(err));
      stream.on('end', () => {
        if (stream.sizeExceeded)
          return callback(Object.assign(new Error('Message exceeds the 1 MiB limit of the local mailbox'), { responseCode: 552 }));
        const raw = Buffer.concat(chunks);
        const envelopeTo = session.envelope.rcptTo.map((a) => a.address);
        const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        parseMail(raw)
          .then((parsed) =>
            db
              .insertInto('mailboxMessage')
              .values({
                receivedAt: new Date().toISOString(),
                from: parsed.from || envelopeFrom,
                // The envelope is who the message was delivered to (it includes Bcc); headers may differ.
                toJson: JSON.stringify(envelopeTo.length ? envelopeTo : parsed.to),
                subject: parsed.subject,
                text: parsed.text ?? '',
                html: parsed.html,
                messageId: parsed.messageId,
                rawSizeBytes: raw.length,
              })
              .execute(),
          )
          .then(
            () => callback(),
            (err: unknown) => {
              log(`local mailbox: could not store a message: ${err instanceof Error ? err.message : String(err)}`);
              callback(Object.assign(new Error('Local mailbox could not store the message'), { responseCode: 451 }));
            },
          );
      });
    },
  });
  server.on('error', (err) => log(`local mailbox: ${err.message}`));
  const port = await new Promise<number>((resolve, reject) => {
    const net = server.listen(0, host, () => resolve((net.address() as AddressInfo).port));
    net.once('error', reject);
  });
  return {
    host,
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
