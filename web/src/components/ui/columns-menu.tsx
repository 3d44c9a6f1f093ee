import { Box, Button, SimpleGrid, Text } from '@chakra-ui/react';
import { useEffect, useId, useRef, useState } from 'react';
import { CheckboxInput } from './choice-inputs';

export interface ColumnChoice {
  id: string;
  label: string;
  /** A column that cannot be hidden (the one that names the row). */
  locked?: boolean;
}

interface ColumnsMenuProps {
  columns: readonly ColumnChoice[];
  visibility: Record<string, boolean>;
  onChange: (visibility: Record<string, boolean>) => void;
}

/** A "Columns" button opening a list of checkboxes, one per column. Escape closes it. */
export function ColumnsMenu({ columns, visibility, onChange }: ColumnsMenuProps) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const buttonRef = useRef<HTMLButtonElement>(null);
  const rootRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!open) return undefined;
    function handlePointer(event: PointerEvent) {
      if (rootRef.current && !rootRef.current.contains(event.target as Node)) setOpen(false);
    }
    document.addEventListener('pointerdown', handlePointer);
    return () => document.removeEventListener('pointerdown', handlePointer);
  }, [open]);

  const shown = columns.filter((column) => visibility[column.id] !== false).length;

  return (
    <Box position="relative" ref={rootRef}>
      <Button
        ref={buttonRef}
        variant="outline"
        size="md"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((value) => !value)}
      >
        Columns
        <Text as="span" color="fg.muted" fontWeight="normal">
          ({shown} of {columns.length})
        </Text>
      </Button>
      <Box
        id={panelId}
        hidden={!open}
        role="group"
        aria-label="Show columns"
        position="absolute"
        insetEnd="0"
        top="calc(100% + 4px)"
        zIndex="dropdown"
        bg="bg.panel"
        borderWidth="1px"
        borderColor="border"
        rounded="md"
        shadow="md"
        p="3"
        minW="64"
        onKeyDown={(event) => {
          if (event.key === 'Escape') {
            setOpen(false);
            buttonRef.current?.focus();
          }
        }}
      >
        <SimpleGrid columns={1} gap="0">
          {columns.map((column) => (
            <CheckboxInput
              key={column.id}
              label={column.label}
              checked={visibility[column.id] !== false}
              disabled={column.locked}
              onChange={(event) => onChange({ ...visibility, [column.id]: event.currentTarget.checked })}
            />
          ))}
        </SimpleGrid>
      </Box>
    </Box>
  );
}
