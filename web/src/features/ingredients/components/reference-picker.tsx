import { Box, Button, Stack, Text } from '@chakra-ui/react';
import type { NutrientReferenceRow } from '@crumbproof/shared';
import { useMemo, useState } from 'react';
import { FormField, TextInput } from '@/components/ui/form-field';
import { Loading } from '@/components/ui/loading';
import { useDisclosure } from '@/lib/use-disclosure';
import { useNutrientReference } from '../api/get-nutrient-reference';

interface ReferencePickerProps {
  onPick: (row: NutrientReferenceRow) => void;
}

/** "Fill from reference table": a searchable list; choosing a row is the one action that fills. */
export function ReferencePicker({ onPick }: ReferencePickerProps) {
  const { open, close, buttonProps, panelProps } = useDisclosure();
  const [search, setSearch] = useState('');
  const reference = useNutrientReference({ enabled: open });

  const rows = useMemo(() => {
    const words = search.trim().toLocaleLowerCase('en-GB').split(/\s+/).filter(Boolean);
    return (reference.data?.rows ?? []).filter((row) => {
      const haystack = `${row.name} ${row.id} ${row.ifct ?? ''} ${row.nutrition.source}`.toLocaleLowerCase('en-GB');
      return words.every((word) => haystack.includes(word));
    });
  }, [reference.data, search]);

  function handlePick(row: NutrientReferenceRow) {
    onPick(row);
    close();
    setSearch('');
  }

  return (
    <Box>
      <Button type="button" variant="outline" size="md" {...buttonProps}>
        Fill from reference table
      </Button>
      <Box {...panelProps} mt="2" p="3" borderWidth="1px" borderColor="border" rounded="md" bg="bg.panel">
        {open ? (
          <Stack gap="3">
            <FormField label="Search the reference table">
              <TextInput type="search" value={search} onChange={(event) => setSearch(event.currentTarget.value)} autoFocus />
            </FormField>
            {reference.isPending ? (
              <Loading size="sm">Loading the reference table…</Loading>
            ) : reference.isError ? (
              <Text color="fg.error">The reference table could not be loaded: {reference.error.message}</Text>
            ) : (
              <>
                <Text textStyle="xs" color="fg.muted">
                  {reference.data.note}
                </Text>
                <Box as="ul" role="list" aria-label="Reference rows" listStyleType="none" m="0" p="0" maxH="64" overflowY="auto">
                  {rows.length === 0 ? (
                    <li>
                      <Text color="fg.muted">No row matches.</Text>
                    </li>
                  ) : (
                    rows.map((row) => (
                      <li key={row.id}>
                        <Button
                          type="button"
                          variant="ghost"
                          size="sm"
                          width="100%"
                          justifyContent="flex-start"
                          height="auto"
                          py="1.5"
                          textAlign="start"
                          whiteSpace="normal"
                          onClick={() => handlePick(row)}
                        >
                          <Stack gap="0" align="flex-start">
                            <Text as="span" fontWeight="bold">
                              {row.name}
                            </Text>
                            <Text as="span" textStyle="xs" color="fg.muted" fontWeight="normal">
                              {row.nutrition.source}
                            </Text>
                          </Stack>
                        </Button>
                      </li>
                    ))
                  )}
                </Box>
              </>
            )}
          </Stack>
        ) : null}
      </Box>
    </Box>
  );
}
