import { Box, Button, HStack, Stack, Text } from '@chakra-ui/react';
import type { PendingApproval } from '@crumbproof/shared';
import { useState } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { Page } from '@/components/ui/page';
import { Panel } from '@/components/ui/panel';
import { isApiError } from '@/lib/api-client';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useApprovals, useApprove } from '../api/approvals';
import { useStaleLabels } from '../api/stale-labels';
import { PendingCard } from '../components/pending-card';
import { StaleLabelsList } from '../components/stale-labels-list';

/**
 * /approvals — products whose declaration changed since a manager approved it (or was never
 * approved), with the change in words and what caused it; the manager approves exactly what is
 * shown (each product's inputHash), the pastry chef reads. Below, printed labels and charts out
 * of date after an approved change, until the manager marks each handled. All of it is the
 * request's kitchen's: each kitchen sharing the recipe book approves its own declarations.
 */
export function ApprovalsRoute() {
  const me = useSignedInUser();
  const isManager = me.role === 'manager';
  const approvals = useApprovals();
  const stale = useStaleLabels();
  const approve = useApprove();
  const [approving, setApproving] = useState<string[]>([]);
  const [done, setDone] = useState<string | null>(null);

  function approveSome(list: PendingApproval[]) {
    setDone(null);
    setApproving(list.map((p) => p.product));
    approve.mutate(
      { products: list.map((p) => ({ product: p.product, inputHash: p.inputHash })) },
      {
        onSuccess: (given) =>
          setDone(`Approved ${given.approved.map((a) => a.name).join(', ')}. Its labels print and the counter shows it.`),
        onSettled: () => setApproving([]),
      },
    );
  }

  const pending = approvals.data?.pending ?? [];
  const error = approve.error;
  return (
    <Page
      title="Approvals"
      lead="A change to an ingredient or recipe reaches every product made with it. Each product’s labels print only once a manager has approved its declaration as it is now."
    >
      <Panel
        title="Waiting for approval"
        aside={
          isManager && pending.length > 1 ? (
            <Button onClick={() => approveSome(pending)} loading={approve.isPending && approving.length > 1} loadingText="Approving…">
              Approve all {pending.length}
            </Button>
          ) : null
        }
      >
        {approvals.isError ? (
          <LoadFailed title="The approvals cannot be read" error={approvals.error} onRetry={() => void approvals.refetch()} />
        ) : !approvals.data ? (
          <Loading size="sm">Reading what waits for approval…</Loading>
        ) : (
          <Stack gap="3">
            {approvals.data.kitchens > 1 ? (
              <Text>
                {`At ${approvals.data.kitchen.name}: these are the declarations as this kitchen makes them, and an approval here approves them here only. The ${
                  approvals.data.kitchens === 2
                    ? 'other kitchen sharing the recipe book approves its'
                    : `other ${approvals.data.kitchens - 1} kitchens sharing the recipe book approve their`
                } own.`}
              </Text>
            ) : null}
            {approvals.data.elsewhere.length > 0 ? (
              <Text>
                {`Also waiting at your other kitchens: ${approvals.data.elsewhere
                  .map((e) => `${e.waiting} ${e.waiting === 1 ? 'product' : 'products'} at ${e.kitchen.name}`)
                  .join(', ')}. Choose the kitchen to see and approve them.`}
              </Text>
            ) : null}
            {!isManager ? <Text color="fg.muted">Only a manager approves; you can read what waits.</Text> : null}
            {error ? (
              <ErrorAlert title="Nothing was approved">
                <Text>{error.message}</Text>
                {isApiError(error) && error.status === 409 ? <Text>The list below is read again: look at it and approve.</Text> : null}
              </ErrorAlert>
            ) : null}
            <Text role="status">{done}</Text>
            {pending.length === 0 ? (
              <Text>
                Nothing waits: every product’s declaration is the one approved ({approvals.data.approvedCount} product
                {approvals.data.approvedCount === 1 ? '' : 's'}).
              </Text>
            ) : (
              <Stack gap="3">
                {pending.map((p) => (
                  <PendingCard
                    key={p.product}
                    pending={p}
                    approving={approve.isPending && approving.includes(p.product) && approving.length === 1}
                    onApprove={isManager ? () => approveSome([p]) : undefined}
                  />
                ))}
              </Stack>
            )}
          </Stack>
        )}
      </Panel>
      <Panel title="Labels out of date">
        {stale.isError ? (
          <LoadFailed title="The out-of-date labels cannot be read" error={stale.error} onRetry={() => void stale.refetch()} />
        ) : !stale.data ? (
          <Loading size="sm">Reading the print log…</Loading>
        ) : (
          <Box>
            <HStack mb="3">
              <Text color="fg.muted">
                Labels and charts printed before an approved change that alters what they say.
                {isManager ? ' Mark each handled once it is reprinted or withdrawn.' : ' A manager marks each handled.'}
              </Text>
            </HStack>
            <StaleLabelsList items={stale.data} canHandle={isManager} />
          </Box>
        )}
      </Panel>
    </Page>
  );
}
