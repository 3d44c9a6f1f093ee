import { labelSettingsSchema, type LabelSettings } from '@crumbproof/shared';

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
