import { EmptyState, PageHeader } from '@/components/ui/states';
import { Authorization } from '@/lib/authorization';
import { MailboxView } from '@/features/mail/components/mailbox-view';
import { OutboxPanel } from '@/features/mail/components/outbox-panel';

export function MailboxRoute() {
  return (
    <>
      <PageHeader
        eyebrow="Admin"
        title="Mailbox"
        subtitle="Every message the local mail service received over SMTP, newest first, and what the app is still sending."
      />
      <Authorization
        policy="mailbox:read"
        fallback={<EmptyState title="Not allowed for your roles">The mailbox is for admins.</EmptyState>}
      >
        <div className="grid gap-6">
          <MailboxView />
          <OutboxPanel />
        </div>
      </Authorization>
    </>
  );
}
