import { Box, Button, HStack, Table, Text } from '@chakra-ui/react';
import { LINE_ROLES, lineQtySchema, UNITS } from '@crumbproof/shared';
import type { ReactNode } from 'react';
import { Controller, useWatch, type Control, type FieldErrors, type UseFieldArrayReturn, type UseFormRegister } from 'react-hook-form';
import { SelectInput, TextInput } from '@/components/ui/form-field';
import { ItemCombobox, type ComboboxOption } from '@/components/ui/item-combobox';
import { EMPTY_LINE, numberOrUndefined, type EditorValues } from './editor-values';

const UNIT_OPTIONS = UNITS.map((unit) => ({ value: unit, label: unit }));
/** Short words fit the column; the title says what a contact line is. */
const ROLE_LABELS: Record<(typeof LINE_ROLES)[number], string> = {
  ingredient: 'Ingredient',
  contact: 'Contact',
};
const ROLE_TITLES = 'Ingredient: part of the recipe. Contact: greasing or dusting, carries allergens but no weight.';
const ROLE_OPTIONS = LINE_ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

interface LineRowsProps {
  control: Control<EditorValues>;
  register: UseFormRegister<EditorValues>;
  lines: UseFieldArrayReturn<EditorValues, 'lines'>;
  errors: FieldErrors<EditorValues>;
  /** Messages from the API for a line, by 0-based index (unknown id, unweighable unit, cycle). */
  apiErrors: ReadonlyMap<number, string[]>;
  /** The declaration's warnings about a line (a weight out of proportion), by 0-based index; they never block saving. */
  lineWarnings: ReadonlyMap<number, string[]>;
  options: readonly ComboboxOption[];
}

function errorIdFor(index: number) {
  return `recipe-line-${index + 1}-error`;
}

function warningIdFor(index: number) {
  return `recipe-line-${index + 1}-warning`;
}

/** What is wrong with a quantity as it is typed (zero, negative, too large), before any save; nothing while the box is empty. */
function typedQtyProblem(qty: unknown): string | null {
  if (typeof qty !== 'number' || Number.isNaN(qty)) return null;
  const parsed = lineQtySchema.safeParse(qty);
  return parsed.success ? null : (parsed.error.issues[0]?.message ?? null);
}

/** The recipe's lines as an editable table: pick by typing, quantity, unit, role, move, remove. */
export function LineRows({ control, register, lines, errors, apiErrors, lineWarnings, options }: LineRowsProps) {
  const { fields, append, remove, move } = lines;
  const watched = useWatch({ control, name: 'lines' });
  return (
    <Box as="fieldset" minW="0">
      <Text as="legend" fontWeight="bold" mb="2">
        Lines
      </Text>
      <Table.ScrollArea
        borderWidth="1px"
        borderColor="border.muted"
        rounded="md"
        bg="bg.panel"
        tabIndex={0}
        role="region"
        aria-label="Recipe lines"
      >
        <Table.Root size="sm" css={{ '& th, & td': { textStyle: 'md', verticalAlign: 'top', paddingInline: '0.375rem' } }}>
          <Table.Header>
            <Table.Row bg="bg.subtle">
              <Table.ColumnHeader scope="col" w="6" textAlign="end">
                #
              </Table.ColumnHeader>
              <Table.ColumnHeader scope="col" minW="11rem">
                Ingredient or recipe
              </Table.ColumnHeader>
              <Table.ColumnHeader scope="col" textAlign="end">
                Quantity
              </Table.ColumnHeader>
              <Table.ColumnHeader scope="col">Unit</Table.ColumnHeader>
              <Table.ColumnHeader scope="col">Role</Table.ColumnHeader>
              <Table.ColumnHeader scope="col">
                <Box srOnly>Order and removal</Box>
              </Table.ColumnHeader>
            </Table.Row>
          </Table.Header>
          <Table.Body>
            {fields.map((field, index) => {
              const n = index + 1;
              const lineErrors = errors.lines?.[index];
              const fromApi = apiErrors.get(index) ?? [];
              const contact = watched?.[index]?.role === 'contact';
              const qtyMessage = lineErrors?.qty?.message ?? (contact ? null : typedQtyProblem(watched?.[index]?.qty));
              const messages: ReactNode[] = [
                lineErrors?.use?.message,
                qtyMessage ? `Quantity: ${qtyMessage}` : undefined,
                lineErrors?.unit?.message,
                ...fromApi,
              ].filter(Boolean);
              // A contact line has no weight: nothing about its weight is ever out of proportion.
              const warnings = contact ? [] : (lineWarnings.get(index) ?? []);
              const describedBy =
                [messages.length > 0 ? errorIdFor(index) : null, warnings.length > 0 ? warningIdFor(index) : null]
                  .filter(Boolean)
                  .join(' ') || undefined;
              return (
                <Table.Row key={field.id} bg="bg.panel" data-line={n}>
                  <Table.Cell textAlign="end" textStyle="quantity" pt="4">
                    {n}
                  </Table.Cell>
                  <Table.Cell>
                    <Controller
                      control={control}
                      name={`lines.${index}.use`}
                      render={({ field: use }) => (
                        <ItemCombobox
                          ref={use.ref}
                          name={use.name}
                          aria-label={`Ingredient or recipe for line ${n}`}
                          aria-describedby={describedBy}
                          invalid={Boolean(lineErrors?.use) || fromApi.length > 0}
                          options={options}
                          value={use.value}
                          onChange={use.onChange}
                          onBlur={use.onBlur}
                        />
                      )}
                    />
                    {messages.length > 0 ? (
                      <Box id={errorIdFor(index)} color="fg.error" fontWeight="bold" textStyle="sm" mt="1">
                        {messages.map((message, i) => (
                          <Text key={i}>{message}</Text>
                        ))}
                      </Box>
                    ) : null}
                    {warnings.length > 0 ? (
                      <Box id={warningIdFor(index)} textStyle="sm" mt="1" maxW="24rem">
                        {warnings.map((message, i) => (
                          <Text key={i}>
                            <span aria-hidden="true">△ </span>
                            <Text as="span" fontWeight="bold">
                              Check:
                            </Text>{' '}
                            {message}
                          </Text>
                        ))}
                      </Box>
                    ) : null}
                  </Table.Cell>
                  {contact ? (
                    <Table.Cell colSpan={2} pt="3">
                      {/* Wrapped within the quantity and unit columns: the table's cells do not wrap by themselves. */}
                      <Text id={`recipe-line-${n}-no-weight`} color="fg.muted" textStyle="sm" maxW="11rem" whiteSpace="normal">
                        No weight: brings its allergens only
                      </Text>
                    </Table.Cell>
                  ) : (
                    <>
                      <Table.Cell>
                        <TextInput
                          type="number"
                          inputMode="decimal"
                          step="any"
                          min="0"
                          textAlign="end"
                          textStyle="quantity"
                          w="5.5rem"
                          px="2"
                          aria-label={`Quantity for line ${n}`}
                          aria-invalid={Boolean(qtyMessage) || undefined}
                          aria-describedby={describedBy}
                          {...register(`lines.${index}.qty`, { setValueAs: numberOrUndefined })}
                        />
                      </Table.Cell>
                      <Table.Cell>
                        <SelectInput
                          aria-label={`Unit for line ${n}`}
                          options={UNIT_OPTIONS}
                          w="5.25rem"
                          {...register(`lines.${index}.unit`)}
                        />
                      </Table.Cell>
                    </>
                  )}
                  <Table.Cell>
                    <SelectInput
                      aria-label={`Role for line ${n}`}
                      title={ROLE_TITLES}
                      options={ROLE_OPTIONS}
                      w="8.75rem"
                      {...register(`lines.${index}.role`)}
                    />
                  </Table.Cell>
                  <Table.Cell>
                    <HStack gap="1" pt="0.5">
                      <Button
                        size="md"
                        px="0"
                        minW="10"
                        variant="outline"
                        aria-label={`Move line ${n} up`}
                        disabled={index === 0}
                        onClick={() => move(index, index - 1)}
                      >
                        ↑
                      </Button>
                      <Button
                        size="md"
                        px="0"
                        minW="10"
                        variant="outline"
                        aria-label={`Move line ${n} down`}
                        disabled={index === fields.length - 1}
                        onClick={() => move(index, index + 1)}
                      >
                        ↓
                      </Button>
                      <Button
                        size="md"
                        px="0"
                        minW="10"
                        variant="ghost"
                        aria-label={`Remove line ${n}`}
                        title="Remove this line"
                        disabled={fields.length === 1}
                        onClick={() => remove(index)}
                      >
                        <span aria-hidden="true">✕</span>
                      </Button>
                    </HStack>
                  </Table.Cell>
                </Table.Row>
              );
            })}
          </Table.Body>
        </Table.Root>
      </Table.ScrollArea>
      {errors.lines?.root?.message || errors.lines?.message ? (
        <Text color="fg.error" fontWeight="bold" mt="1">
          {errors.lines?.root?.message ?? errors.lines?.message}
        </Text>
      ) : null}
      <Text color="fg.muted" textStyle="sm" mt="1">
        A contact line (greasing a tin, dusting a board) brings its allergens but no weight: it takes no quantity, and what it brings is
        declared under contains.
      </Text>
      <Button mt="3" size="lg" variant="outline" onClick={() => append({ ...EMPTY_LINE })}>
        Add line
      </Button>
    </Box>
  );
}
