import { errnoOf, retryingConflicts } from './conflict-retry';

const conflict = (errno: number) => Object.assign(new Error(`errno ${errno}`), { original: { errno } });

describe('retryingConflicts', () => {
  it('runs a transaction again after a deadlock or certification conflict (1213) and gives its result', async () => {
    let calls = 0;
    const result = await retryingConflicts(() => {
      calls += 1;
      return calls < 3 ? Promise.reject(conflict(1213)) : Promise.resolve('committed');
    });
    expect(result).toBe('committed');
    expect(calls).toBe(3);
  });

  it('gives up after the last attempt with the conflict itself', async () => {
    let calls = 0;
    await expect(
      retryingConflicts(() => {
        calls += 1;
        return Promise.reject(conflict(1205));
      }, 3),
    ).rejects.toThrow('errno 1205');
    expect(calls).toBe(3);
  });

  it.each([[conflict(1062)], [new Error('no errno')], [Object.assign(new Error('recipe cycle'), { code: 'recipe-cycle' })]])(
    'never retries another failure (%p)',
    async (err) => {
      let calls = 0;
      await expect(
        retryingConflicts(() => {
          calls += 1;
          return Promise.reject(err);
        }),
      ).rejects.toBe(err);
      expect(calls).toBe(1);
    },
  );

  it('runs it again when a statement beside the one that lost finds the transaction ended', async () => {
    let calls = 0;
    await retryingConflicts(() => {
      calls += 1;
      return calls === 1
        ? Promise.reject(new Error('rollback has been called on this transaction(1f2e), you can no longer use it.'))
        : Promise.resolve();
    });
    expect(calls).toBe(2);
  });

  it('reads the error number from Sequelize and from the driver', () => {
    expect(errnoOf({ parent: { errno: 1213 } })).toBe(1213);
    expect(errnoOf({ errno: 1205 })).toBe(1205);
    expect(errnoOf(null)).toBeUndefined();
  });
});
