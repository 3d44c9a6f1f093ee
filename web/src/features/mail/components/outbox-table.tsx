import { Badge, Button, Text } from '@chakra-ui/react';
import { MAIL_STATE_LABELS, type MailState, type OutboxMail } from '@crumbproof/shared';
import { useMemo } from 'react';
import { DataTable, dataTableColumns, type DataTableColumn } from '@/components/ui/data-table';
import { Quantity } from '@/components/ui/quantity';

const when = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });
const format = (iso: string | null) => (iso ? when.format(new Date(iso)) : '');

/** The kinds of mail Crumbproof sends today, in words; another feature's kind shows as it is written. */
const KIND_LABELS: Record<string, string> = { invitation: 'Invitation', 'password-reset': 'Password link' };

/** State in words first, with a border of its own: solid sent, dashed waiting, double not sent. */
function StateBadge({ state }: { state: MailState }) {
  const style = { sent: 'solid', queued: 'dashed', failed: 'double' } as const;
  return (
    <Badge
      size="lg"
      variant="outline"
      borderWidth={state === 'failed' ? '3px' : '1px'}
      borderStyle={style[state]}
      fontWeight={state === 'failed' ? 'bold' : 'normal'}
    >
      {MAIL_STATE_LABELS[state]}
    </Badge>
  );
}

const column = dataTableColumns<OutboxMail>();

interface OutboxTableProps {
  mails: OutboxMail[];
  maxAttempts: number;
  onRetry: (mail: OutboxMail) => void;
  retryingId: string | null;
}

export function OutboxTable({ mails, maxAttempts, onRetry, retryingId }: OutboxTableProps) {
  const columns = useMemo<DataTableColumn<OutboxMail>[]>(
    () => [
      column.accessor('createdAt', {
        header: 'Queued',
        cell: (info) => <Quantity>{format(info.row.original.createdAt)}</Quantity>,
        meta: { numeric: true },
      }),
      column.accessor('subject', {
        header: 'Mail',
        meta: { maxW: '18rem' },
        cell: (info) => {
          const mail = info.row.original;
          return (
            <>
              <Text fontWeight="bold">{mail.subject}</Text>
              <Text fontSize="sm">
                {KIND_LABELS[mail.kind] ?? mail.kind} to {mail.recipients.join(', ')}
              </Text>
            </>
          );
        },
      }),
      column.accessor('state', {
        header: 'State',
        cell: (info) => {
          const mail = info.row.original;
          return (
            <>
              <StateBadge state={mail.state} />
              {/* Below 1024 px the attempts fold in here, leaving room for the error and the send button. */}
              <Text hideFrom="lg">
                <Quantity>{`${mail.attempts} of ${maxAttempts} attempts`}</Quantity>
              </Text>
              {mail.state === 'sent' ? (
                <Text fontSize="sm">{format(mail.sentAt)}</Text>
              ) : mail.state === 'queued' && mail.attempts > 0 ? (
                <Text fontSize="sm">Tried again at {format(mail.nextAttemptAt)}</Text>
              ) : null}
            </>
          );
        },
      }),
      column.accessor('attempts', {
        header: 'Attempts',
        cell: (info) => <Quantity>{`${info.row.original.attempts} of ${maxAttempts}`}</Quantity>,
        meta: { numeric: true, hideBelow: 'lg' },
      }),
      column.accessor('lastError', {
        header: 'Last error',
        meta: { maxW: '14rem' },
        cell: (info) => info.row.original.lastError ?? <Text color="fg.muted">None</Text>,
        enableSorting: false,
      }),
      column.display({
        id: 'actions',
        header: 'Send',
        cell: (info) => {
          const mail = info.row.original;
          if (mail.state !== 'failed') return null;
          return (
            <Button
              size="lg"
              variant="outline"
              aria-label={`Send again “${mail.subject}” to ${mail.recipients.join(', ')}`}
              loading={retryingId === mail.id}
              onClick={() => onRetry(mail)}
            >
              Send again
            </Button>
          );
        },
      }),
    ],
    [maxAttempts, onRetry, retryingId],
  );

  return (
    <DataTable
      caption="Mail sent by Crumbproof, newest first"
      columns={columns}
      data={mails}
      getRowId={(mail) => mail.id}
      rowTone={(mail) => (mail.state === 'failed' ? 'attention' : undefined)}
      empty="No mail yet. Invitations and password links show here once they are sent."
    />
  );
}
