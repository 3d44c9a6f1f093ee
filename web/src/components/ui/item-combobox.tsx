import { Box, Input, Text } from '@chakra-ui/react';
import { forwardRef, useEffect, useId, useMemo, useState, type KeyboardEvent } from 'react';

export interface ComboboxOption {
  value: string;
  label: string;
  /** A short word shown beside the option: "Recipe", "Ingredient". */
  hint?: string;
}

interface ItemComboboxProps {
  options: readonly ComboboxOption[];
  /** The chosen option's value (an id), or text the person typed that matches none. */
  value: string;
  onChange: (value: string) => void;
  onBlur?: () => void;
  'aria-label'?: string;
  id?: string;
  name?: string;
  invalid?: boolean;
  'aria-describedby'?: string;
  placeholder?: string;
  disabled?: boolean;
  /** At most this many suggestions are listed. */
  limit?: number;
}

function labelFor(options: readonly ComboboxOption[], value: string): string {
  return options.find((option) => option.value === value)?.label ?? value;
}

function matches(option: ComboboxOption, query: string): boolean {
  const q = query.trim().toLowerCase();
  if (q === '') return true;
  return option.label.toLowerCase().includes(q) || option.value.toLowerCase().includes(q);
}

/**
 * Pick one item by typing part of its name (WAI-ARIA combobox with a list box).
 * Arrow keys move through the suggestions, Enter picks, Escape closes. Leaving the field keeps an
 * exact match by name or id; other text is kept as typed, so whoever checks the value can name it.
 */
export const ItemCombobox = forwardRef<HTMLInputElement, ItemComboboxProps>(function ItemCombobox(
  { options, value, onChange, onBlur, invalid, limit = 40, placeholder = 'Type to search', disabled, ...inputProps },
  ref,
) {
  const listId = useId();
  const [text, setText] = useState(() => labelFor(options, value));
  const [open, setOpen] = useState(false);
  const [focused, setFocused] = useState(false);
  const [active, setActive] = useState(0);

  // Follow the value when it changes from outside (options loaded, line moved, form reset).
  useEffect(() => {
    if (!focused) setText(labelFor(options, value));
  }, [options, value, focused]);

  const suggestions = useMemo(() => options.filter((option) => matches(option, text)).slice(0, limit), [options, text, limit]);
  const activeOption = open ? suggestions[active] : undefined;
  const optionId = (index: number) => `${listId}-option-${index}`;

  function choose(option: ComboboxOption) {
    setText(option.label);
    setOpen(false);
    onChange(option.value);
  }

  function commitTyped() {
    const typed = text.trim();
    const exact = options.find(
      (option) => option.label.toLowerCase() === typed.toLowerCase() || option.value.toLowerCase() === typed.toLowerCase(),
    );
    if (exact) {
      setText(exact.label);
      if (exact.value !== value) onChange(exact.value);
    } else if (typed !== value) {
      onChange(typed);
    }
  }

  function handleKeyDown(event: KeyboardEvent<HTMLInputElement>) {
    switch (event.key) {
      case 'ArrowDown':
        event.preventDefault();
        if (!open) setOpen(true);
        else setActive((index) => Math.min(index + 1, suggestions.length - 1));
        break;
      case 'ArrowUp':
        event.preventDefault();
        setActive((index) => Math.max(index - 1, 0));
        break;
      case 'Enter':
        if (open && activeOption) {
          event.preventDefault();
          choose(activeOption);
        }
        break;
      case 'Escape':
        if (open) {
          event.preventDefault();
          setOpen(false);
        }
        break;
      default:
        break;
    }
  }

  return (
    <Box position="relative" w="full">
      <Input
        ref={ref}
        {...inputProps}
        size="lg"
        bg="bg.panel"
        borderColor="border"
        role="combobox"
        autoComplete="off"
        aria-autocomplete="list"
        aria-expanded={open}
        aria-controls={listId}
        aria-activedescendant={activeOption ? optionId(active) : undefined}
        aria-invalid={invalid || undefined}
        disabled={disabled}
        placeholder={placeholder}
        value={text}
        onChange={(event) => {
          setText(event.currentTarget.value);
          setActive(0);
          setOpen(true);
        }}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          setOpen(false);
          commitTyped();
          onBlur?.();
        }}
        onKeyDown={handleKeyDown}
      />
      <Box
        as="ul"
        id={listId}
        role="listbox"
        aria-label="Suggestions"
        hidden={!open || suggestions.length === 0}
        position="absolute"
        zIndex="dropdown"
        insetStart="0"
        top="100%"
        mt="1"
        minW="full"
        maxH="64"
        overflowY="auto"
        listStyleType="none"
        m="0"
        p="1"
        bg="bg.panel"
        borderWidth="1px"
        borderColor="border"
        rounded="md"
        boxShadow="md"
      >
        {suggestions.map((option, index) => (
          <Box
            as="li"
            key={option.value}
            id={optionId(index)}
            role="option"
            aria-selected={index === active}
            px="3"
            py="2"
            rounded="sm"
            cursor="pointer"
            display="flex"
            justifyContent="space-between"
            gap="3"
            bg={index === active ? 'accent.subtle' : undefined}
            onMouseDown={(event) => event.preventDefault()}
            onMouseEnter={() => setActive(index)}
            onClick={() => choose(option)}
          >
            <Text as="span">{option.label}</Text>
            {option.hint ? (
              <Text as="span" color="fg.muted" textStyle="sm">
                {option.hint}
              </Text>
            ) : null}
          </Box>
        ))}
      </Box>
    </Box>
  );
});
