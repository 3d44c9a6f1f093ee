import { Box, Button, HStack, Link, SimpleGrid, Stack, Text } from '@chakra-ui/react';
import { KITCHEN_WRITERS, type SwapApplied, type SwapPreview, type SwapRequest } from '@crumbproof/shared';
import { useEffect, useId, useMemo, useRef, useState, type FormEvent } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormField, SelectInput } from '@/components/ui/form-field';
import { ItemCombobox, type ComboboxOption } from '@/components/ui/item-combobox';
import { buildItemLookup } from '@/components/ui/item-lookup';
import { hrefFor } from '@/components/ui/layer-path';
import { Page } from '@/components/ui/page';
import { RoleRequired } from '@/components/ui/role-required';
import { isApiError } from '@/lib/api-client';
import { useApplySwap } from '../api/apply-swap';
import { useSwapChoices } from '../api/get-swap-choices';
import { usePreviewSwap } from '../api/preview-swap';
import { SwapResult } from '../components/swap-result';

const EVERYWHERE = '';

function fieldMessage(error: unknown, path: string): string | undefined {
  return isApiError(error) ? error.fields.find((field) => field.path === path)?.message : undefined;
}

function SwapCheck() {
  const { recipes, ingredients } = useSwapChoices();
  const preview = usePreviewSwap();
  const apply = useApplySwap();
  const [from, setFrom] = useState('');
  const [to, setTo] = useState('');
  const [where, setWhere] = useState(EVERYWHERE);
  const [checked, setChecked] = useState<{ request: SwapRequest; result: SwapPreview } | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [applied, setApplied] = useState<{ result: SwapApplied; preview: SwapPreview } | null>(null);
  const confirmId = useId();
  const confirmRef = useRef<HTMLDivElement>(null);
  const doneRef = useRef<HTMLDivElement>(null);

  const options = useMemo<ComboboxOption[]>(
    () =>
      [
        ...(ingredients.data ?? []).map((item) => ({ value: item.id, label: item.name, hint: 'Ingredient' })),
        ...(recipes.data ?? []).map((item) => ({ value: item.id, label: item.name, hint: 'Recipe' })),
      ].sort((a, b) => a.label.localeCompare(b.label)),
    [ingredients.data, recipes.data],
  );

  const whereOptions = useMemo(() => {
    const users = (recipes.data ?? []).filter((recipe) => !from || recipe.lines.some((line) => line.use === from));
    return [
      { value: EVERYWHERE, label: 'Every recipe that uses it' },
      ...users.map((recipe) => ({ value: recipe.id, label: recipe.name })),
    ];
  }, [recipes.data, from]);

  const lookup = useMemo(
    () =>
      buildItemLookup({
        recipes: recipes.data,
        ingredients: ingredients.data,
        declarations: (checked?.result.products ?? []).flatMap((product) => [product.after, product.before]),
      }),
    [recipes.data, ingredients.data, checked],
  );

  /** A result answers one question; changing the question clears it. */
  function ask(next: { from?: string; to?: string; where?: string }) {
    const question = { from, to, where, ...next };
    if (question.from === from && question.to === to && question.where === where) return;
    setFrom(question.from);
    setTo(question.to);
    setWhere(question.where);
    setChecked(null);
    setConfirming(false);
  }

  useEffect(() => {
    if (confirming) confirmRef.current?.focus();
  }, [confirming]);

  useEffect(() => {
    if (applied) doneRef.current?.focus();
  }, [applied]);

  function request(): SwapRequest {
    return { from, to, ...(where ? { recipe: where } : {}) };
  }

  function handleCheck(event: FormEvent) {
    event.preventDefault();
    setApplied(null);
    apply.reset();
    const body = request();
    preview.mutate(body, { onSuccess: (result) => setChecked({ request: body, result }) });
  }

  function handleApply() {
    if (!checked) return;
    const { request: body, result } = checked;
    apply.mutate(body, {
      onSuccess: (done) => {
        setApplied({ result: done, preview: result });
        setChecked(null);
        setConfirming(false);
      },
    });
  }

  const listError = recipes.error ?? ingredients.error;
  const count = checked?.result.recipes.length ?? 0;

  return (
    <Page
      title="Swap check"
      lead="See what every product would declare if one ingredient were replaced by another, before anything is saved."
    >
      {listError ? <ErrorAlert title="The recipes and ingredients could not be loaded">{listError.message}</ErrorAlert> : null}
      <form aria-label="Swap to check" noValidate onSubmit={handleCheck}>
        <Stack gap="4">
          <SimpleGrid columns={{ base: 1, md: 3 }} gap="4">
            <FormField label="Replace" error={fieldMessage(preview.error, 'from')}>
              <ItemCombobox
                options={options}
                value={from}
                // The scope lists recipes that use the ingredient replaced; a new one starts from everywhere.
                onChange={(next) => ask(next === from ? {} : { from: next, where: EVERYWHERE })}
              />
            </FormField>
            <FormField label="With" error={fieldMessage(preview.error, 'to')}>
              <ItemCombobox options={options} value={to} onChange={(next) => ask({ to: next })} />
            </FormField>
            <FormField label="Where" error={fieldMessage(preview.error, 'recipe')}>
              <SelectInput options={whereOptions} value={where} onChange={(event) => ask({ where: event.currentTarget.value })} />
            </FormField>
          </SimpleGrid>
          <Button
            type="submit"
            size="lg"
            alignSelf="flex-start"
            loading={preview.isPending}
            loadingText="Checking…"
            disabled={!from || !to}
          >
            Check the swap
          </Button>
        </Stack>
      </form>

      {preview.isError ? <ErrorAlert title="The swap cannot be checked">{preview.error.message}</ErrorAlert> : null}

      {applied ? (
        <Box ref={doneRef} tabIndex={-1} role="status" bg="accent.subtle" borderWidth="1px" borderColor="accent.solid" rounded="md" p="4">
          <Text fontWeight="bold">
            {`Swap applied: ${applied.preview.from.name} replaced with ${applied.preview.to.name}. ${applied.result.recipes.length} ${
              applied.result.recipes.length === 1 ? 'recipe has' : 'recipes have'
            } a new revision.`}
          </Text>
          <Box as="ul" ps="5" m="0" mt="2">
            {applied.result.recipes.map((recipe) => (
              <li key={recipe.id}>
                <Link asChild color="accent.fg" fontWeight="bold">
                  <RouterLink to={hrefFor(recipe.id, 'recipe')}>{lookup(recipe.id)?.name ?? recipe.id}</RouterLink>
                </Link>
                {`: revision ${recipe.revision}`}
              </li>
            ))}
          </Box>
          {applied.preview.products.length > 0 ? (
            <>
              <Text mt="3" fontWeight="bold">
                Products to check
              </Text>
              <Box as="ul" ps="5" m="0">
                {applied.preview.products.map((product) => (
                  <li key={`${product.kitchen.id} ${product.product}`}>
                    <Link asChild color="accent.fg" fontWeight="bold">
                      <RouterLink to={hrefFor(product.product, 'recipe')}>{product.name}</RouterLink>
                    </Link>
                    {applied.preview.kitchens.length > 1 ? ` at ${product.kitchen.name}` : null}
                  </li>
                ))}
              </Box>
            </>
          ) : null}
        </Box>
      ) : null}

      {checked ? (
        <SwapResult preview={checked.result} lookup={lookup}>
          {apply.isError ? <ErrorAlert title="The swap was not applied; nothing was saved">{apply.error.message}</ErrorAlert> : null}
          {confirming ? (
            <Box
              ref={confirmRef}
              tabIndex={-1}
              role="group"
              aria-labelledby={confirmId}
              borderWidth="2px"
              borderColor="accent.solid"
              rounded="md"
              p="4"
            >
              <Text id={confirmId} fontWeight="bold">
                {`Apply the swap? ${count} ${count === 1 ? 'recipe gets' : 'recipes get'} a new revision: ${checked.result.recipes
                  .map((recipe) => recipe.name)
                  .join(', ')}.`}
              </Text>
              <HStack mt="3" gap="3" wrap="wrap">
                <Button size="lg" onClick={handleApply} loading={apply.isPending} loadingText="Applying…">
                  {`Yes, apply to ${count} ${count === 1 ? 'recipe' : 'recipes'}`}
                </Button>
                <Button size="lg" variant="outline" onClick={() => setConfirming(false)}>
                  Cancel
                </Button>
              </HStack>
            </Box>
          ) : (
            <Button size="lg" alignSelf="flex-start" onClick={() => setConfirming(true)} disabled={count === 0}>
              Apply swap
            </Button>
          )}
        </SwapResult>
      ) : null}
    </Page>
  );
}

/** /recipes/swap — manager and pastry chef only. */
export function SwapCheckRoute() {
  return (
    <RoleRequired roles={KITCHEN_WRITERS} doing="check and apply swaps" back={{ to: '/recipes', label: 'Back to recipes' }}>
      <SwapCheck />
    </RoleRequired>
  );
}
