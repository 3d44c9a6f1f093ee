/**
 * Whether the counter's answers are live: the events stream is open and the last read of the
 * kitchen succeeded after it opened. Once the stream drops (or the browser goes offline, or a
 * read fails), the counter says since when it has not been live, keeps what it last read, and
 * says so until a read started after the stream is open again succeeds: events sent while it was
 * away are lost, so only a fresh read can catch up.
 */
export interface FreshnessState {
  connection: 'connecting' | 'open' | 'lost';
  /** When it stopped being live (epoch ms); null while live. */
  notLiveSince: number | null;
  /** Counts every open and every loss, so a catch-up read started before the last of them cannot end the banner. */
  epoch: number;
}

export type FreshnessEvent =
  { type: 'opened' } | { type: 'lost'; at: number } | { type: 'read-failed'; at: number } | { type: 'caught-up'; epoch: number };

export const INITIAL_FRESHNESS: FreshnessState = { connection: 'connecting', notLiveSince: null, epoch: 0 };

export function freshnessReducer(state: FreshnessState, event: FreshnessEvent): FreshnessState {
  switch (event.type) {
    case 'opened':
      return { ...state, connection: 'open', epoch: state.epoch + 1 };
    case 'lost':
      if (state.connection === 'lost' && state.notLiveSince !== null) return state;
      return { connection: 'lost', notLiveSince: state.notLiveSince ?? event.at, epoch: state.epoch + 1 };
    case 'read-failed':
      // Already not live: the catch-up in progress keeps trying; nothing new to say.
      if (state.notLiveSince !== null) return state;
      return { ...state, notLiveSince: event.at, epoch: state.epoch + 1 };
    case 'caught-up':
      if (event.epoch !== state.epoch || state.connection !== 'open') return state;
      return { ...state, notLiveSince: null };
  }
}

/** The stream is open again but what was missed has not been read yet: read everything again. */
export const needsCatchUp = (state: FreshnessState) => state.connection === 'open' && state.notLiveSince !== null;

/** HH:MM in the browser's time, as the counter shows times. */
export function clockTime(at: number | string): string {
  const date = new Date(at);
  return `${String(date.getHours()).padStart(2, '0')}:${String(date.getMinutes()).padStart(2, '0')}`;
}

/** The banner's words, or null while live. */
export function notLiveMessage(state: FreshnessState, computedAt: string | undefined): string | null {
  if (state.notLiveSince === null) return null;
  const since = `Not live since ${clockTime(state.notLiveSince)}`;
  const showing = computedAt ? `: showing the data computed at ${clockTime(computedAt)}` : '';
  return `${since}${showing}. Reconnecting…`;
}
