import { Box, Button, SimpleGrid, Text } from '@chakra-ui/react';
import { useEffect, useRef } from 'react';
import { useDisclosure } from '@/lib/use-disclosure';
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
  const { open, setOpen, buttonProps, panelProps } = useDisclosure();
  const rootRef = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!open) return undefined;
    function handlePointer(event: PointerEvent) {
      if (rootRef.current && !rootRef.current.contains(event.target as Node)) setOpen(false);
    }
    document.addEventListener('pointerdown', handlePointer);
    return () => document.removeEventListener('pointerdown', handlePointer);
  }, [open, setOpen]);

  const shown = columns.filter((column) => visibility[column.id] !== false).length;

  return (
    <Box position="relative" ref={rootRef}>
      <Button variant="outline" size="md" {...buttonProps}>
        Columns
        <Text as="span" color="fg.muted" fontWeight="normal">
          ({shown} of {columns.length})
        </Text>
      </Button>
      <Box
        {...panelProps}
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
