import { Box, Link } from '@chakra-ui/react';
import { createContext, useContext, type ReactNode } from 'react';
import { Link as RouterLink } from 'react-router-dom';

/** What a screen knows about an id it shows: its name, and whether it is a recipe or an ingredient. */
export interface ItemInfo {
  name: string;
  kind: 'recipe' | 'ingredient';
}

export type ItemLookup = (id: string) => ItemInfo | undefined;

export interface LayerStep {
  id: string;
  name: string;
  href: string;
}

export function hrefFor(id: string, kind: ItemInfo['kind']): string {
  const segment = encodeURIComponent(id);
  return kind === 'recipe' ? `/recipes/${segment}` : `/ingredients/${segment}`;
}

/**
 * Turns a path of ids (product first, leaf last) into named, linked steps. Every step above the
 * leaf is a recipe; the leaf is an ingredient unless the lookup says otherwise.
 */
export function layerSteps(path: readonly string[], lookup: ItemLookup): LayerStep[] {
  return path.map((id, index) => {
    const info = lookup(id);
    const kind = info?.kind ?? (index < path.length - 1 ? 'recipe' : 'ingredient');
    return { id, name: info?.name ?? id, href: hrefFor(id, kind) };
  });
}

/**
 * What a shortened path list left out (Provenance.viaMore): the paths not drawn, all through
 * parts of the product a drawn path already names. Null when nothing was left out.
 */
export function morePathsText(more: number | undefined, productName: string): string | null {
  if (!more) return null;
  return `And ${pathsCount(more, 'more')} through the same parts of ${productName}, not drawn.`;
}

/** "1 other path", "11 more paths": a count of paths a list left out, in words. */
export function pathsCount(n: number, word: 'more' | 'other'): string {
  return `${n} ${word} path${n === 1 ? '' : 's'}`;
}

/** "Victoria sponge → Vanilla sponge → Butter". */
export function pathText(path: readonly string[], lookup: ItemLookup): string {
  return path.map((id) => lookup(id)?.name ?? id).join(' → ');
}

/**
 * Which bars may be links: a page whose reader cannot open ingredient pages (front of house)
 * says so once, and the bars that lead there are drawn as plain bars. Default: every bar links.
 */
const LinkPolicyContext = createContext<(href: string) => boolean>(() => true);

interface LayerPathLinksProps {
  canOpen: (href: string) => boolean;
  children: ReactNode;
}

export function LayerPathLinks({ canOpen, children }: LayerPathLinksProps) {
  return <LinkPolicyContext.Provider value={canOpen}>{children}</LinkPolicyContext.Provider>;
}

export function useCanOpenPath(): (href: string) => boolean {
  return useContext(LinkPolicyContext);
}

/** A bar already named and linked (a screen that knows its names without a lookup). */
export interface LayerPathItem {
  label: string;
  href: string;
}

type LayerPathProps =
  | { path: readonly string[]; lookup: ItemLookup; items?: never; label?: never }
  | {
      /** From the product (top) down to the leaf (bottom). */
      items: readonly LayerPathItem[];
      /** Names the path for assistive technology; defaults to "Layer path: A → B → C". */
      label?: string;
      path?: never;
      lookup?: never;
    };

/**
 * Crumbproof's provenance mark: a short stack of bars, the product on top and the leaf at the
 * bottom, each bar a link to that recipe or ingredient. Each layer steps in a little, like the
 * brand mark, and the leaf bar is outlined rather than filled.
 */
export function LayerPath(props: LayerPathProps) {
  const canOpen = useCanOpenPath();
  const steps =
    props.items !== undefined
      ? props.items.map((item, index) => ({ id: `${index}`, name: item.label, href: item.href }))
      : layerSteps(props.path, props.lookup);
  return (
    <Box
      as="ol"
      listStyleType="none"
      m="0"
      p="0"
      display="flex"
      flexDirection="column"
      gap="1"
      minW="0"
      aria-label={props.label ?? `Layer path: ${steps.map((step) => step.name).join(' → ')}`}
    >
      {steps.map((step, index) => {
        const leaf = index === steps.length - 1;
        const linked = canOpen(step.href);
        return (
          <Box as="li" key={`${step.id}-${index}`} ps={`${Math.min(index, 4) * 0.75}rem`} minW="0">
            <Link
              asChild
              display="block"
              px="2.5"
              py="0.5"
              rounded="full"
              textStyle="sm"
              lineHeight="1.6"
              overflowWrap="anywhere"
              textDecoration="none"
              borderWidth="1.5px"
              borderColor="accent.solid"
              borderStyle="solid"
              borderBottomWidth={leaf ? '3px' : '1.5px'}
              bg={leaf ? 'bg.panel' : index === 0 ? 'accent.solid' : 'accent.emphasized'}
              color={leaf ? 'accent.fg' : index === 0 ? 'accent.contrast' : 'fg'}
              fontWeight={leaf ? 'bold' : 'normal'}
              _hover={linked ? { textDecoration: 'underline' } : undefined}
            >
              {linked ? <RouterLink to={step.href}>{step.name}</RouterLink> : <span>{step.name}</span>}
            </Link>
          </Box>
        );
      })}
    </Box>
  );
}
