import { labelSettingsSchema, type LabelSettings } from '@crumbproof/shared';
import { DEMO_BAKEHOUSE, DEMO_CAFE } from './demo-users';

/**
 * The demo kitchen's label settings. The GS1 numbers are invented for the demo: GS1 keeps the
 * prefix 952 for demonstrations and examples (GS1 General Specifications, from memory), so the
 * company prefix 9521234, the demo products' GTINs built on it (demo-book.json) and the SSCCs
 * printed from it belong to no company.
 */
export const DEMO_LABEL_SETTINGS: LabelSettings = labelSettingsSchema.parse({
  batchPattern: '{YY}{MM}{DD}-{P}-{N}',
  gs1CompanyPrefix: '9521234',
  ssccExtension: 0,
  caseIndicator: 1,
});

/**
 * Each demo chain kitchen's label settings, by its id in the book. Both print under the one
 * invented company prefix, so each has an extension digit of its own (an SSCC is the extension,
 * the prefix and the kitchen's serial: two kitchens counting serials apart never print the same
 * one), and the café's batch codes start with its letters, so a code names its kitchen.
 */
export const DEMO_CHAIN_LABEL_SETTINGS: Record<string, LabelSettings> = {
  [DEMO_BAKEHOUSE]: DEMO_LABEL_SETTINGS,
  [DEMO_CAFE]: labelSettingsSchema.parse({
    batchPattern: 'SY{YY}{MM}{DD}-{P}-{N}',
    gs1CompanyPrefix: '9521234',
    ssccExtension: 1,
    caseIndicator: 1,
  }),
};
