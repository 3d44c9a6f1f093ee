import { Stack, Text } from '@chakra-ui/react';
import { publicBaseUrlSchema, publicPagePath, publicPageSettingsSchema, type PublicPageSettingsView } from '@crumbproof/shared';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { CheckboxInput } from '@/components/ui/choice-inputs';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, TextInput } from '@/components/ui/form-field';
import { SaveBar } from '@/components/ui/save-bar';
import { isApiError } from '@/lib/api-client';
import { useUpdatePublicPageSettings } from '../api/update-public-page-settings';

interface FormValues {
  enabled: boolean;
  baseUrl: string;
}

/**
 * The manager turns the public product page on or off and gives the address customers reach
 * Crumbproof at; the counter tickets of published products carry a QR code to their page there.
 */
export function PublicPageForm({ settings }: { settings: PublicPageSettingsView }) {
  const update = useUpdatePublicPageSettings();
  const [saved, setSaved] = useState<string | null>(null);
  const { register, control, handleSubmit, setError, clearErrors, formState } = useForm<FormValues>({
    defaultValues: { enabled: settings.enabled, baseUrl: settings.baseUrl ?? '' },
  });
  const [enabled, baseUrl = ''] = useWatch({ control, name: ['enabled', 'baseUrl'] });
  const parsedUrl = publicBaseUrlSchema.safeParse(baseUrl);
  const example = parsedUrl.success ? `${parsedUrl.data}${publicPagePath('lemon-tart', settings.kitchen)}` : null;

  function handleSave(values: FormValues) {
    setSaved(null);
    clearErrors();
    const parsed = publicPageSettingsSchema.safeParse({
      enabled: values.enabled,
      baseUrl: values.baseUrl.trim() === '' ? null : values.baseUrl,
    });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) setError(issue.path[0] === 'enabled' ? 'enabled' : 'baseUrl', { message: issue.message });
      return;
    }
    update.mutate(parsed.data, {
      onSuccess: (result) =>
        setSaved(
          result.enabled
            ? 'Saved. Published products have their page, and their counter tickets carry its QR code.'
            : 'Saved. The public product page is off: every address of it says there is no page.',
        ),
      onError: (error) => {
        if (!isApiError(error)) return;
        for (const field of error.fields) setError(field.path === 'enabled' ? 'enabled' : 'baseUrl', { message: field.message });
      },
    });
  }

  const errors = formState.errors;
  return (
    <form aria-label="Public product page" noValidate onSubmit={handleSubmit(handleSave)}>
      <Stack gap="4" maxW="4xl">
        <Text color="fg.muted">
          A page for each product marked published in the recipe editor, which customers open without signing in, from the QR code on its
          counter ticket: what it has, may contain and what is not known, with the caution. It shows no supplier, quantity or other record
          of the kitchen.
        </Text>
        <CheckboxInput {...register('enabled')}>Turn on the public product page</CheckboxInput>
        <FormField
          label="Address customers reach Crumbproof at"
          error={errors.baseUrl?.message}
          hint={
            example
              ? `A product with the id lemon-tart gets the page ${example}.`
              : 'For example https://menu.your-bakery.co.uk: the address of this installation as a phone outside the kitchen reaches it.'
          }
        >
          <TextInput type="url" inputMode="url" autoComplete="off" spellCheck={false} {...register('baseUrl')} />
        </FormField>
        {errors.enabled?.message ? <ErrorAlert>{errors.enabled.message}</ErrorAlert> : null}
        {update.isError && !(isApiError(update.error) && update.error.fields.length > 0) ? (
          <ErrorAlert title="Public page settings not saved">{update.error.message}</ErrorAlert>
        ) : null}
        {!enabled && settings.enabled ? <Text fontWeight="bold">Saving turns the page off: its QR codes will lead to no page.</Text> : null}
        <SaveBar label="Save public page settings" pending={update.isPending} status={saved} />
      </Stack>
    </form>
  );
}
