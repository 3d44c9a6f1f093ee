import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { RECIPES, SLOT_RECIPES } from './theme';

/**
 * The recipe each Chakra component takes its styles from. A component with none (layout boxes,
 * text) needs no entry in the theme; a component missing from this table fails the test below,
 * so whoever imports a new one decides which recipe it needs.
 */
const RECIPE_OF: Record<string, string | null> = {
  Alert: 'alert',
  Badge: 'badge',
  Box: null,
  Button: 'button',
  chakra: null,
  ChakraProvider: null,
  CloseButton: 'button',
  Code: 'code',
  Collapsible: 'collapsible',
  createSystem: null,
  defaultBaseConfig: null,
  defineConfig: null,
  Dialog: 'dialog',
  Drawer: 'drawer',
  Field: 'field',
  Flex: null,
  Grid: null,
  Heading: 'heading',
  HStack: null,
  Icon: 'icon',
  Input: 'input',
  InputProps: null,
  Link: 'link',
  List: 'list',
  NativeSelect: 'nativeSelect',
  Portal: null,
  Progress: 'progress',
  SimpleGrid: null,
  Spinner: 'spinner',
  Stack: null,
  Table: 'table',
  Text: null,
  Textarea: 'textarea',
  TextProps: null,
  VStack: null,
  Wrap: null,
};

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (statSync(path).isDirectory()) return sourceFiles(path);
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [path] : [];
  });
}

function chakraImports(): Set<string> {
  const names = new Set<string>();
  for (const file of sourceFiles(join(__dirname, '..'))) {
    for (const match of readFileSync(file, 'utf8').matchAll(/import\s*(?:type\s*)?\{([^}]*)\}\s*from\s*'@chakra-ui\/react'/g)) {
      for (const part of (match[1] ?? '').split(',')) {
        const name = (part.replace(/\btype\b/, '').split(/\s+as\s+/)[0] ?? '').trim();
        if (name) names.add(name);
      }
    }
  }
  return names;
}

describe('the theme carries the styles of every Chakra component the app uses', () => {
  const used = [...chakraImports()];
  const keys = new Set([...Object.keys(RECIPES), ...Object.keys(SLOT_RECIPES)]);

  it('knows which recipe each imported component needs', () => {
    expect(used.filter((name) => !(name in RECIPE_OF))).toEqual([]);
  });

  it('has the recipe of each component imported', () => {
    const missing = used.flatMap((name) => {
      const recipe = RECIPE_OF[name];
      return recipe && !keys.has(recipe) ? [`${name} needs ${recipe}`] : [];
    });
    expect(missing).toEqual([]);
  });

  it('finds the components the app is known to use', () => {
    // A broken scan would find nothing and pass the two checks above.
    expect(used).toEqual(expect.arrayContaining(['Button', 'Table', 'Field', 'Dialog']));
  });
});
