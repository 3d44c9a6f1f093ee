export * from './ask';
export * from './classify';
export { readAloud, COUNTER_CAUTION, type ReadAloud } from './read-aloud';
export type { PrecautionReason } from './precautions';
