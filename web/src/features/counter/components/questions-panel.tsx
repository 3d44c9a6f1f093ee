import { Box, Button, Field, Heading, Stack, Text, Textarea } from '@chakra-ui/react';
import {
  counterAnswerSchema,
  KITCHEN_WRITERS,
  SOURCE_LABELS,
  type AllergenSource,
  type CounterQuestionView,
  type CounterRules,
} from '@crumbproof/shared';
import { Fragment, useId, useState, type FormEvent } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { LoadFailed } from '@/components/ui/load-failed';
import { Loading } from '@/components/ui/loading';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { useSignedInUser } from '@/lib/signed-in-user';
import { useAnswerCounterQuestion, useCounterQuestions } from '../api/questions';

interface QuestionsPanelProps {
  /** The kitchen's regime groups (CounterProductsView.rules), to say each allergen asked about in words. */
  rules?: CounterRules;
}

const isSource = (code: string): code is AllergenSource => Object.prototype.hasOwnProperty.call(SOURCE_LABELS, code);

/** An allergen asked about, in words: the regime's group label ("Cereals containing gluten") or the source's name ("walnut"). */
export function avoidWords(code: string, rules: CounterRules | undefined): string {
  const group = rules?.groups.find((g) => g.code === code);
  if (group) return group.label;
  if (isSource(code)) return SOURCE_LABELS[code];
  return code.replace(/-/g, ' ');
}

/**
 * Questions front of house asked the kitchen: those waiting for an answer first, then the answered,
 * each newest first, with the product, what the customer avoids, who asked and when, and the note.
 * The manager and pastry chef answer here; everyone sees the answers.
 */
export function QuestionsPanel({ rules }: QuestionsPanelProps) {
  const questions = useCounterQuestions();
  const me = useSignedInUser();
  const canAnswer = KITCHEN_WRITERS.includes(me.role);

  if (questions.isPending) return <Loading>Loading the questions…</Loading>;
  if (questions.isError)
    return <LoadFailed title="The questions could not be loaded" error={questions.error} onRetry={() => void questions.refetch()} />;

  const open = questions.data.filter((q) => q.answer === null);
  const answered = questions.data.filter((q) => q.answer !== null);

  return (
    <Stack gap="6" fontSize="xl">
      <Stack gap="1">
        <Heading as="h2" size="2xl">
          Questions for the kitchen
        </Heading>
        <Text role="status" color="fg.muted">
          {open.length === 0
            ? 'No question is waiting for an answer.'
            : open.length === 1
              ? '1 question is waiting for an answer.'
              : `${open.length} questions are waiting for an answer.`}
        </Text>
      </Stack>
      {questions.data.length === 0 ? (
        <Text>No questions have been asked yet. Front of house asks from a product’s card.</Text>
      ) : (
        <>
          <QuestionList title="Waiting for an answer" questions={open} rules={rules} canAnswer={canAnswer} />
          <QuestionList title="Answered" questions={answered} rules={rules} canAnswer={false} />
        </>
      )}
    </Stack>
  );
}

interface QuestionListProps {
  title: string;
  questions: CounterQuestionView[];
  rules: CounterRules | undefined;
  canAnswer: boolean;
}

function QuestionList({ title, questions, rules, canAnswer }: QuestionListProps) {
  const headingId = useId();
  if (questions.length === 0) return null;
  return (
    <Box as="section" aria-labelledby={headingId}>
      <Heading as="h3" size="xl" id={headingId} mb="3">
        {title}
      </Heading>
      <Stack as="ul" gap="4" m="0" ps="0" listStyleType="none">
        {questions.map((question) => (
          <li key={question.id}>
            <QuestionCard question={question} rules={rules} canAnswer={canAnswer} />
          </li>
        ))}
      </Stack>
    </Box>
  );
}

interface QuestionCardProps {
  question: CounterQuestionView;
  rules: CounterRules | undefined;
  canAnswer: boolean;
}

function QuestionCard({ question, rules, canAnswer }: QuestionCardProps) {
  const headingId = useId();
  const words = question.avoid.map((code) => avoidWords(code, rules));
  return (
    <Box
      as="article"
      aria-labelledby={headingId}
      bg="bg.panel"
      borderWidth="1px"
      borderColor={question.answer ? 'border.muted' : 'border.emphasized'}
      borderStartWidth={question.answer ? '1px' : '4px'}
      rounded="md"
      p={{ base: '4', md: '5' }}
    >
      <Stack gap="2">
        <Heading as="h4" size="lg" id={headingId}>
          {question.productName}
        </Heading>
        <Text>
          Avoids{' '}
          {words.map((word, i) => (
            <Fragment key={question.avoid[i]}>
              {i === 0 ? '' : i === words.length - 1 ? ' and ' : ', '}
              <strong>{word}</strong>
            </Fragment>
          ))}
        </Text>
        <Text color="fg.muted" fontSize="lg">
          Asked by {question.askedBy}, {formatDateTime(question.askedAt)}
        </Text>
        {question.note ? <Text>Note: {question.note}</Text> : null}
        {question.answer ? (
          <Box bg="bg.subtle" rounded="md" p="3" mt="1">
            <Text fontWeight="bold">The kitchen’s answer</Text>
            <Text whiteSpace="pre-wrap">{question.answer.text}</Text>
            <Text color="fg.muted" fontSize="lg">
              {question.answer.by}, {formatDateTime(question.answer.at)}
            </Text>
          </Box>
        ) : canAnswer ? (
          <AnswerForm question={question} />
        ) : (
          <Text fontStyle="italic">Waiting for the kitchen’s answer.</Text>
        )}
      </Stack>
    </Box>
  );
}

function AnswerForm({ question }: { question: CounterQuestionView }) {
  const answer = useAnswerCounterQuestion();
  const [text, setText] = useState('');
  const [fieldError, setFieldError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const parsed = counterAnswerSchema.safeParse({ answer: text });
    if (!parsed.success) {
      setFieldError(parsed.error.issues[0]?.message ?? 'Write the answer for the counter.');
      return;
    }
    setFieldError(null);
    answer.mutate(
      { id: question.id, answer: parsed.data.answer },
      {
        onError: (error) => {
          const onAnswer = isApiError(error) ? error.fields.find((f) => f.path === 'answer') : undefined;
          if (onAnswer && !(isApiError(error) && error.code === 'conflict')) setFieldError(onAnswer.message);
          else setFormError(isApiError(error) ? error.message : 'The answer was not sent. Check the connection and try again.');
        },
      },
    );
  }

  return (
    <form noValidate onSubmit={handleSubmit} aria-label={`Answer about ${question.productName}`}>
      <Stack gap="3" mt="1">
        {formError ? <ErrorAlert title="The answer was not sent">{formError}</ErrorAlert> : null}
        <Field.Root invalid={Boolean(fieldError)}>
          <Field.Label fontWeight="bold" fontSize="lg">
            Answer for the counter
          </Field.Label>
          <Textarea
            value={text}
            onChange={(e) => setText(e.currentTarget.value)}
            rows={3}
            fontSize="lg"
            bg="bg.panel"
            borderColor="border"
            maxLength={1000}
          />
          {fieldError ? (
            <Field.ErrorText color="fg.error" fontWeight="bold" fontSize="md">
              {fieldError}
            </Field.ErrorText>
          ) : null}
        </Field.Root>
        <Button type="submit" size="xl" minH="12" alignSelf="flex-start" loading={answer.isPending} loadingText="Sending…">
          Send the answer
        </Button>
      </Stack>
    </form>
  );
}
