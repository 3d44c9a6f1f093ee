import { Button, Stack } from '@chakra-ui/react';
import { signInSchema, type Me, type SignInRequest } from '@crumbproof/shared';
import { useRef, useState, type FormEvent } from 'react';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { placeFieldErrors } from '@/lib/place-field-errors';
import { useSignIn } from '../api/sign-in';

interface SignInFormProps {
  onSignedIn: (me: Me) => void;
}

type Field = keyof SignInRequest;
const FIELDS: readonly Field[] = ['email', 'password'];

/**
 * The first page anyone loads, so it carries no form library: two fields checked against the
 * shared sign-in contract, with its messages beside the fields, as every other form shows them.
 */
export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const [formError, setFormError] = useState<string | null>(null);
  const [errors, setErrors] = useState<Partial<Record<Field, string>>>({});
  const inputs = useRef<Partial<Record<Field, HTMLInputElement | null>>>({});

  function showErrors(found: Partial<Record<Field, string>>) {
    setErrors(found);
    const first = FIELDS.find((f) => found[f]);
    if (first) inputs.current[first]?.focus();
  }

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setFormError(null);
    const data = new FormData(event.currentTarget);
    const parsed = signInSchema.safeParse({ email: data.get('email') ?? '', password: data.get('password') ?? '' });
    if (!parsed.success) {
      const found: Partial<Record<Field, string>> = {};
      for (const issue of parsed.error.issues) {
        const field = issue.path[0] as Field;
        found[field] ??= issue.message;
      }
      showErrors(found);
      return;
    }
    setErrors({});
    signIn.mutate(parsed.data, {
      onSuccess: onSignedIn,
      onError: (error) => {
        const placed: Partial<Record<Field, string>> = {};
        setFormError(
          placeFieldErrors(error, FIELDS, (field, e) => (placed[field] = e.message), 'Signing in did not work. Try again in a moment.'),
        );
        showErrors(placed);
      },
    });
  }

  return (
    <form noValidate onSubmit={handleSubmit}>
      <Stack gap="5">
        {formError ? <ErrorAlert>{formError}</ErrorAlert> : null}
        <FormField label="Email" error={errors.email}>
          <TextInput
            name="email"
            type="email"
            autoComplete="username"
            inputMode="email"
            ref={(el) => {
              inputs.current.email = el;
            }}
          />
        </FormField>
        <FormField label="Password" error={errors.password}>
          <TextInput
            name="password"
            type="password"
            autoComplete="current-password"
            ref={(el) => {
              inputs.current.password = el;
            }}
          />
        </FormField>
        <Button type="submit" size="lg" loading={signIn.isPending} loadingText="Signing in…">
          Sign in
        </Button>
      </Stack>
    </form>
  );
}
