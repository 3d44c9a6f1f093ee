import { describe, expect, it } from 'vitest';
import { freshnessReducer, INITIAL_FRESHNESS, needsCatchUp, notLiveMessage, type FreshnessEvent, type FreshnessState } from './freshness';

const at = (hhmm: string) => new Date(`2026-12-02T${hhmm}:00`).getTime();
const run = (events: FreshnessEvent[], from: FreshnessState = INITIAL_FRESHNESS) => events.reduce(freshnessReducer, from);
const COMPUTED = new Date(at('08:10')).toISOString();

describe('the counter’s freshness', () => {
  it('is live once the stream opens, and shows no banner', () => {
    const state = run([{ type: 'opened' }]);
    expect(state.connection).toBe('open');
    expect(notLiveMessage(state, COMPUTED)).toBeNull();
    expect(needsCatchUp(state)).toBe(false);
  });

  it('says since when it is not live and what it shows when the stream drops', () => {
    const state = run([{ type: 'opened' }, { type: 'lost', at: at('08:42') }]);
    expect(notLiveMessage(state, COMPUTED)).toBe('Not live since 08:42: showing the data computed at 08:10. Reconnecting…');
  });

  it('keeps the first time it stopped being live through further errors', () => {
    const state = run([
      { type: 'opened' },
      { type: 'lost', at: at('08:42') },
      { type: 'lost', at: at('08:45') },
      { type: 'read-failed', at: at('08:47') },
    ]);
    expect(notLiveMessage(state, COMPUTED)).toMatch(/^Not live since 08:42/);
  });

  it('keeps the banner when the stream opens again, until a read started after that succeeds', () => {
    const reopened = run([{ type: 'opened' }, { type: 'lost', at: at('08:42') }, { type: 'opened' }]);
    expect(needsCatchUp(reopened)).toBe(true);
    expect(notLiveMessage(reopened, COMPUTED)).not.toBeNull();
    const caughtUp = freshnessReducer(reopened, { type: 'caught-up', epoch: reopened.epoch });
    expect(notLiveMessage(caughtUp, COMPUTED)).toBeNull();
    expect(needsCatchUp(caughtUp)).toBe(false);
  });

  it('does not end the banner on a catch-up read started before a later loss', () => {
    const reopened = run([{ type: 'opened' }, { type: 'lost', at: at('08:42') }, { type: 'opened' }]);
    const stale = reopened.epoch;
    const again = run([{ type: 'lost', at: at('08:50') }, { type: 'opened' }], reopened);
    expect(notLiveMessage(freshnessReducer(again, { type: 'caught-up', epoch: stale }), COMPUTED)).not.toBeNull();
    // Still not live since the first loss.
    expect(notLiveMessage(again, COMPUTED)).toMatch(/^Not live since 08:42/);
  });

  it('does not end the banner while the stream is still down, whatever a read says', () => {
    const down = run([{ type: 'opened' }, { type: 'lost', at: at('08:42') }]);
    expect(freshnessReducer(down, { type: 'caught-up', epoch: down.epoch })).toBe(down);
    expect(needsCatchUp(down)).toBe(false);
  });

  it('counts a failed read as not live even with the stream open, and catches up from it', () => {
    const failed = run([{ type: 'opened' }, { type: 'read-failed', at: at('09:01') }]);
    expect(notLiveMessage(failed, COMPUTED)).toBe('Not live since 09:01: showing the data computed at 08:10. Reconnecting…');
    expect(needsCatchUp(failed)).toBe(true);
    expect(notLiveMessage(freshnessReducer(failed, { type: 'caught-up', epoch: failed.epoch }), COMPUTED)).toBeNull();
  });

  it('says it is not live without a time of data when nothing was ever read', () => {
    expect(notLiveMessage(run([{ type: 'lost', at: at('07:58') }]), undefined)).toBe('Not live since 07:58. Reconnecting…');
  });
});
