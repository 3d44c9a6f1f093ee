import { COUNTER_EVENT_TYPES, type CounterEvent } from '@crumbproof/shared';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useEffect, useReducer, useState } from 'react';
import { queryKeys } from '@/api/query-keys';
import { withKitchen } from '@/lib/kitchen-choice';
import { freshnessReducer, INITIAL_FRESHNESS, needsCatchUp, type FreshnessState } from '../utils/freshness';

export const COUNTER_EVENTS_URL = '/api/counter/events';
/** How long to wait before a failed catch-up read, or a stream the server closed for good, is tried again. */
export const RETRY_MS = 3_000;

/** What each pushed event makes the counter read again. */
export function refreshFor(queryClient: QueryClient, event: CounterEvent): void {
  switch (event.type) {
    case 'declarations-changed':
      void queryClient.invalidateQueries({ queryKey: queryKeys.counter.products() });
      // A recipe page open in this browser reads its declaration again too.
      void queryClient.invalidateQueries({ queryKey: queryKeys.declarations.all() });
      return;
    case 'question-asked':
    case 'question-answered':
      void queryClient.invalidateQueries({ queryKey: queryKeys.counter.questions() });
      return;
    case 'display-changed':
      void queryClient.invalidateQueries({ queryKey: queryKeys.counter.products() });
      void queryClient.invalidateQueries({ queryKey: queryKeys.counter.day(event.date) });
      return;
  }
}

function parseEvent(type: string, data: unknown): CounterEvent | null {
  if (typeof data !== 'string') return null;
  try {
    const event = JSON.parse(data) as CounterEvent;
    return event.type === type ? event : null;
  } catch {
    return null;
  }
}

const isCounterQuery = (key: readonly unknown[]) => key[0] === queryKeys.counter.all()[0];

/**
 * Keeps the counter live: listens to the events stream (EventSource reconnects by itself; going
 * back online reconnects at once), reads again what each event changes, notices failed reads,
 * and after any break reads everything again before it says it is live.
 */
export function useCounterFreshness(): FreshnessState {
  const queryClient = useQueryClient();
  const [state, dispatch] = useReducer(freshnessReducer, INITIAL_FRESHNESS);
  // Bumped to open a new stream: back online, or the server closed the stream for good.
  const [connection, setConnection] = useState(0);

  useEffect(() => {
    if (typeof EventSource === 'undefined') {
      dispatch({ type: 'lost', at: Date.now() });
      return;
    }
    // A stream cannot carry the header: its address names the kitchen.
    const source = new EventSource(withKitchen(COUNTER_EVENTS_URL), { withCredentials: true });
    let reopen: ReturnType<typeof setTimeout> | undefined;
    source.addEventListener('open', () => dispatch({ type: 'opened' }));
    source.addEventListener('error', () => {
      dispatch({ type: 'lost', at: Date.now() });
      // CLOSED: the browser will not try again by itself (the server refused the stream).
      if (source.readyState === EventSource.CLOSED) reopen = setTimeout(() => setConnection((n) => n + 1), RETRY_MS);
    });
    for (const type of COUNTER_EVENT_TYPES) {
      source.addEventListener(type, (message: MessageEvent) => {
        const event = parseEvent(type, message.data);
        if (event) refreshFor(queryClient, event);
      });
    }
    return () => {
      clearTimeout(reopen);
      source.close();
    };
  }, [queryClient, connection]);

  useEffect(() => {
    const offline = () => dispatch({ type: 'lost', at: Date.now() });
    const online = () => setConnection((n) => n + 1);
    window.addEventListener('offline', offline);
    window.addEventListener('online', online);
    if (typeof navigator !== 'undefined' && navigator.onLine === false) offline();
    return () => {
      window.removeEventListener('offline', offline);
      window.removeEventListener('online', online);
    };
  }, []);

  // A read of the counter's data that fails means it is not live either.
  useEffect(
    () =>
      queryClient.getQueryCache().subscribe((event) => {
        if (event.type === 'updated' && event.action.type === 'error' && isCounterQuery(event.query.queryKey as readonly unknown[])) {
          dispatch({ type: 'read-failed', at: Date.now() });
        }
      }),
    [queryClient],
  );

  // Back after a break: read everything again; live once that read, started after the stream opened, succeeds.
  const catchUp = needsCatchUp(state);
  const { epoch } = state;
  useEffect(() => {
    if (!catchUp) return;
    let cancelled = false;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const attempt = async () => {
      try {
        void queryClient.invalidateQueries({ queryKey: queryKeys.declarations.all() });
        await queryClient.invalidateQueries({ queryKey: queryKeys.counter.all() }, { throwOnError: true });
        if (!cancelled) dispatch({ type: 'caught-up', epoch });
      } catch {
        if (!cancelled) timer = setTimeout(() => void attempt(), RETRY_MS);
      }
    };
    void attempt();
    return () => {
      cancelled = true;
      clearTimeout(timer);
    };
  }, [queryClient, catchUp, epoch]);

  return state;
}
