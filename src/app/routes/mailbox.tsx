import { PageHeader } from '@/components/ui/states';
import { MailboxView } from '@/features/mail/components/mailbox-view';

export function MailboxRoute() {
  return (
    <>
      <PageHeader eyebrow="Admin" title="Mailbox" subtitle="Every message the local mail service received over SMTP, newest first." />
      <MailboxView />
    </>
  );
}
