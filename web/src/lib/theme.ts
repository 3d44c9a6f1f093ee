import { createSystem, defaultBaseConfig, defineConfig } from '@chakra-ui/react';
import {
  alertSlotRecipe,
  animationStyles,
  breakpoints,
  cssVarsPrefix,
  cssVarsRoot,
  globalCss,
  keyframes,
  layerStyles,
  semanticTokens,
  textStyles,
  tokens,
  badgeRecipe,
  buttonRecipe,
  codeRecipe,
  collapsibleSlotRecipe,
  dialogSlotRecipe,
  drawerSlotRecipe,
  fieldSlotRecipe,
  headingRecipe,
  iconRecipe,
  inputRecipe,
  linkRecipe,
  listSlotRecipe,
  nativeSelectSlotRecipe,
  progressSlotRecipe,
  spinnerRecipe,
  tableSlotRecipe,
  textareaRecipe,
} from '@chakra-ui/react/theme';

/**
 * Crumbproof's look: warm paper, dark ink and one accent, damson.
 * Components use the semantic tokens below (bg.canvas, fg.muted, accent.solid…), never raw colours.
 * Every text/background pair here meets WCAG AA (ink on paper 15.6:1, muted ink on paper 7.9:1,
 * damson on paper 10.3:1, paper on damson 11:1, error brick on paper 7.5:1); control borders are 3.9:1.
 */
const fontStack = "'Atkinson Hyperlegible', ui-sans-serif, system-ui, sans-serif";

/**
 * The styles of the Chakra components the app uses, and no others: the whole default theme would
 * add every component's styles to the first page's download. A component used without its
 * recipe here renders unstyled; theme.test.ts fails when one is imported without it.
 */
export const RECIPES = {
  badge: badgeRecipe,
  button: buttonRecipe,
  code: codeRecipe,
  heading: headingRecipe,
  icon: iconRecipe,
  input: inputRecipe,
  link: linkRecipe,
  spinner: spinnerRecipe,
  textarea: textareaRecipe,
};

export const SLOT_RECIPES = {
  alert: alertSlotRecipe,
  collapsible: collapsibleSlotRecipe,
  dialog: dialogSlotRecipe,
  drawer: drawerSlotRecipe,
  field: fieldSlotRecipe,
  list: listSlotRecipe,
  nativeSelect: nativeSelectSlotRecipe,
  progress: progressSlotRecipe,
  table: tableSlotRecipe,
};

/** Chakra's own theme (tokens, text and layer styles, global styles) with only those recipes. */
const chakraTheme = defineConfig({
  preflight: true,
  cssVarsPrefix,
  cssVarsRoot,
  globalCss,
  theme: {
    breakpoints,
    keyframes,
    tokens,
    semanticTokens,
    textStyles,
    layerStyles,
    animationStyles,
    recipes: RECIPES,
    slotRecipes: SLOT_RECIPES,
  },
});

const config = defineConfig({
  globalCss: {
    html: {
      colorPalette: 'accent',
      bg: 'bg.canvas',
      color: 'fg',
    },
    body: {
      bg: 'bg.canvas',
      color: 'fg',
      fontFamily: 'body',
      fontSize: 'md',
      lineHeight: '1.5',
    },
    '::selection': { bg: 'accent.muted', color: 'fg' },
    // Motion only explains a change; people who ask for less motion get none.
    '*, *::before, *::after': {
      _motionReduce: {
        animationDuration: '0.01ms !important',
        animationIterationCount: '1 !important',
        transitionDuration: '0.01ms !important',
        scrollBehavior: 'auto !important',
      },
    },
  },
  theme: {
    tokens: {
      fonts: {
        body: { value: fontStack },
        heading: { value: fontStack },
      },
      colors: {
        paper: {
          50: { value: '#FFFDF8' },
          100: { value: '#FAF5EC' },
          200: { value: '#F2EADB' },
          300: { value: '#E4D7C2' },
          400: { value: '#D2C1A6' },
        },
        ink: {
          500: { value: '#8A7862' },
          700: { value: '#574A3E' },
          900: { value: '#231B14' },
        },
        damson: {
          50: { value: '#F6EDF3' },
          100: { value: '#ECD9E6' },
          200: { value: '#DDB9D1' },
          500: { value: '#8A4A78' },
          700: { value: '#5E2750' },
          800: { value: '#4B1F40' },
        },
        brick: {
          50: { value: '#FBEAE5' },
          700: { value: '#8F2D1C' },
        },
      },
    },
    semanticTokens: {
      colors: {
        bg: {
          DEFAULT: { value: '{colors.paper.100}' },
          canvas: { value: '{colors.paper.100}' },
          panel: { value: '{colors.paper.50}' },
          subtle: { value: '{colors.paper.200}' },
          muted: { value: '{colors.paper.300}' },
          emphasized: { value: '{colors.paper.400}' },
          error: { value: '{colors.brick.50}' },
        },
        fg: {
          DEFAULT: { value: '{colors.ink.900}' },
          muted: { value: '{colors.ink.700}' },
          subtle: { value: '{colors.ink.700}' },
          inverted: { value: '{colors.paper.50}' },
          error: { value: '{colors.brick.700}' },
        },
        border: {
          DEFAULT: { value: '{colors.ink.500}' },
          emphasized: { value: '{colors.ink.700}' },
          muted: { value: '{colors.paper.400}' },
          subtle: { value: '{colors.paper.300}' },
          error: { value: '{colors.brick.700}' },
        },
        accent: {
          solid: { value: '{colors.damson.700}' },
          contrast: { value: '{colors.paper.50}' },
          fg: { value: '{colors.damson.700}' },
          muted: { value: '{colors.damson.200}' },
          subtle: { value: '{colors.damson.50}' },
          emphasized: { value: '{colors.damson.100}' },
          focusRing: { value: '{colors.damson.700}' },
          hover: { value: '{colors.damson.800}' },
        },
        /** The ink of an allergen status mark: shape carries the meaning, not colour. */
        mark: {
          ink: { value: '{colors.ink.900}' },
        },
      },
    },
    textStyles: {
      /** Quantities and percentages line up in columns. */
      quantity: { value: { fontVariantNumeric: 'tabular-nums' } },
    },
  },
});

export const system = createSystem(defaultBaseConfig, chakraTheme, config);
