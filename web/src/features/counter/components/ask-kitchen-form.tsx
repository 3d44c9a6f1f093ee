import { Button, Field, Stack, Text, Textarea } from '@chakra-ui/react';
import { counterQuestionSchema, type CounterProduct } from '@crumbproof/shared';
import { useState } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { useAskCounterQuestion } from '../api/ask-question';
import { clockTime } from '../utils/freshness';
import { listed } from '../utils/lookup';

interface AskKitchenFormProps {
  product: CounterProduct;
  /** The codes picked, as the API takes them. */
  avoid: readonly string[];
  /** The same, in words. */
  avoidLabels: readonly string[];
  onDone: () => void;
}

/** Sends the kitchen a question about the product for the allergens picked, with an optional note; says when it was sent. */
export function AskKitchenForm({ product, avoid, avoidLabels, onDone }: AskKitchenFormProps) {
  const ask = useAskCounterQuestion();
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | null>(null);

  const handleSend = () => {
    const request = { product: product.id, avoid: [...avoid], ...(note.trim() ? { note } : {}) };
    const checked = counterQuestionSchema.safeParse(request);
    if (!checked.success) {
      setProblem(checked.error.issues.map((i) => i.message).join(' '));
      return;
    }
    setProblem(null);
    ask.mutate(checked.data);
  };

  if (ask.isSuccess) {
    return (
      <Stack gap="4">
        <Text role="status" fontSize="xl" fontWeight="bold">
          Sent to the kitchen at {clockTime(ask.data.askedAt)}.
        </Text>
        <Text fontSize="lg">The kitchen’s answer shows on this product’s card and on the Questions view as soon as it is given.</Text>
        <Button alignSelf="flex-start" minH="12" fontSize="xl" onClick={onDone}>
          Back to the product
        </Button>
      </Stack>
    );
  }

  return (
    <Stack gap="4">
      {avoid.length === 0 ? (
        <ErrorAlert title="Pick what the customer avoids first">
          The kitchen is asked about allergens: go back, pick at least one allergen the customer must avoid, and ask again.
        </ErrorAlert>
      ) : (
        <Text fontSize="xl">
          The customer avoids{' '}
          <Text as="strong" fontWeight="bold">
            {listed([...avoidLabels])}
          </Text>
          .
        </Text>
      )}
      <Field.Root invalid={Boolean(problem)}>
        <Field.Label fontWeight="bold" fontSize="lg">
          Note for the kitchen (optional)
        </Field.Label>
        <Textarea
          value={note}
          onChange={(e) => setNote(e.currentTarget.value)}
          maxLength={500}
          rows={3}
          fontSize="lg"
          bg="bg.panel"
          borderColor="border"
          placeholder="For example: severe allergy, asks about the sprinkles"
        />
        {problem ? (
          <Field.ErrorText color="fg.error" fontWeight="bold" fontSize="md">
            {problem}
          </Field.ErrorText>
        ) : null}
      </Field.Root>
      {ask.isError ? <ErrorAlert title="The question was not sent">{ask.error.message}</ErrorAlert> : null}
      <Stack direction="row" gap="3" wrap="wrap">
        <Button minH="12" fontSize="xl" onClick={handleSend} loading={ask.isPending} disabled={avoid.length === 0}>
          Send to the kitchen
        </Button>
        <Button minH="12" fontSize="xl" variant="outline" onClick={onDone}>
          Back to the product
        </Button>
      </Stack>
    </Stack>
  );
}
