import { REGIME_LABELS, REGIMES, type Regime } from '@crumbproof/shared';
import { FormField, SelectInput } from '@/components/ui/form-field';

const OPTIONS = REGIMES.map((regime) => ({ value: regime, label: `${REGIME_LABELS[regime]} (${regime})` }));

interface RegimeSelectProps {
  value: Regime | undefined;
  kitchenRegime: Regime | undefined;
  onChange: (regime: Regime) => void;
}

/** Which country's rules the declaration follows; the kitchen's own by default. */
export function RegimeSelect({ value, kitchenRegime, onChange }: RegimeSelectProps) {
  return (
    <FormField label="Regime" hint={kitchenRegime ? `This kitchen declares under ${REGIME_LABELS[kitchenRegime]}.` : undefined}>
      <SelectInput
        options={OPTIONS}
        value={value ?? kitchenRegime ?? ''}
        minW="64"
        onChange={(event) => onChange(event.currentTarget.value as Regime)}
      />
    </FormField>
  );
}
