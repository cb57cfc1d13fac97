import type { Db } from '../../db/database';
import { startLocalMailServer, type LocalMailServer } from './mail.local-server';
import { MailSender } from './mail.sender';

export interface MailRuntime {
  /** 'local': the fake SMTP service in this process receives everything; 'smtp': mail goes to SMTP_URL. */
  mode: 'local' | 'smtp';
  /** Port of the local service on 127.0.0.1, null with SMTP_URL. */
  localPort: number | null;
  sender: MailSender;
  /** Sends what is due now (or at `now`); resolves to the number of outbox rows tried. */
  flush: (now?: Date) => Promise<number>;
  close: () => Promise<void>;
}

export interface MailSettings {
  smtpUrl?: string;
  from: string;
  publicUrl: string;
  pollIntervalMs?: number;
}

/**
 * Starts mail: without SMTP_URL the local fake SMTP service first (random free port on 127.0.0.1),
 * then the outbox sender pointed at it; with SMTP_URL only the sender, pointed at that server.
 */
export async function startMail(db: Db, settings: MailSettings, log: (message: string) => void): Promise<MailRuntime> {
  const local: LocalMailServer | null = settings.smtpUrl ? null : await startLocalMailServer(db, log);
  const sender = new MailSender(db, {
    smtp: settings.smtpUrl ?? { host: local!.host, port: local!.port },
    from: settings.from,
    publicUrl: settings.publicUrl,
    log,
    pollIntervalMs: settings.pollIntervalMs,
  });
  sender.start();
  return {
    mode: local ? 'local' : 'smtp',
    localPort: local?.port ?? null,
    sender,
    flush: (now) => sender.processDue(now),
    close: async () => {
      await sender.stop();
      await local?.close();
    },
  };
}
