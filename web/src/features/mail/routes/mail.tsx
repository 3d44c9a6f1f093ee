import { Text } from '@chakra-ui/react';
import { useState } from 'react';
import { useKitchenName } from '@/api/kitchen';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { useOutbox } from '../api/get-outbox';
import { useRetryMail } from '../api/retry-mail';
import { OutboxTable } from '../components/outbox-table';

/** The manager's view of the outbox: what was sent, what waits, what could not be sent and why. */
export function MailRoute() {
  const outbox = useOutbox();
  const retry = useRetryMail();
  const [said, setSaid] = useState<string | null>(null);
  // The outbox is per kitchen: the mail about this kitchen, and password links to its people.
  const kitchen = useKitchenName();

  return (
    <Page
      title="Mail"
      lead={`Every mail Crumbproof sends about ${kitchen ?? 'this kitchen'}: invitations, password links to its people and what other pages tell them. A mail the mail server does not take is tried again after 1, 5, 15 and 60 minutes; after the last attempt it waits here as not sent until you send it again.`}
    >
      {retry.isError ? <ErrorAlert title="The mail was not sent again">{retry.error.message}</ErrorAlert> : null}
      <Text role="status">{said}</Text>
      {outbox.isPending ? (
        <Loading>Loading the outbox…</Loading>
      ) : outbox.isError ? (
        <LoadFailed title="The outbox could not be loaded" error={outbox.error} onRetry={() => void outbox.refetch()} />
      ) : (
        <>
          {!outbox.data.sending ? (
            <ErrorAlert title="No mail server is set">
              Mail waits here until one is: set SMTP_HOST and MAIL_FROM in Crumbproof’s settings and start it again.
            </ErrorAlert>
          ) : null}
          <OutboxTable
            mails={outbox.data.mails}
            maxAttempts={outbox.data.maxAttempts}
            retryingId={retry.isPending ? retry.variables : null}
            onRetry={(mail) => {
              setSaid(null);
              retry.mutate(mail.id, { onSuccess: () => setSaid(`“${mail.subject}” is queued to be sent again now.`) });
            }}
          />
          {outbox.data.total > outbox.data.mails.length ? (
            <Text color="fg.muted">
              The newest {outbox.data.mails.length} of {outbox.data.total} mails.
            </Text>
          ) : null}
        </>
      )}
    </Page>
  );
}
