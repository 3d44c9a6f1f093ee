import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';

// next-themes renders its no-flash <script> into the tree; React notes it once per render. Not a fault.
const consoleError = console.error.bind(console);
console.error = (...args: unknown[]) => {
  if (typeof args[0] === 'string' && args[0].startsWith('Encountered a script tag')) return;
  consoleError(...args);
};

// jsdom has no matchMedia; next-themes and Chakra's responsive styles ask for it.
if (!window.matchMedia) {
  Object.defineProperty(window, 'matchMedia', {
    writable: true,
    configurable: true,
    value: (query: string): MediaQueryList => ({
      matches: false,
      media: query,
      onchange: null,
      addListener: () => {},
      removeListener: () => {},
      addEventListener: () => {},
      removeEventListener: () => {},
      dispatchEvent: () => false,
    }),
  });
}

// Chakra's scroll areas and popovers observe their size.
if (!('ResizeObserver' in window)) {
  class ResizeObserverShim {
    observe() {}
    unobserve() {}
    disconnect() {}
  }
  Object.defineProperty(window, 'ResizeObserver', { writable: true, configurable: true, value: ResizeObserverShim });
}

// jsdom does not implement scrolling.
window.scrollTo = () => {};
Element.prototype.scrollIntoView = () => {};

// findBy… and waitFor wait for the app as a user would; on a busy 2-core machine a first render
// can take longer than Testing Library's one second.
configure({ asyncUtilTimeout: 5000 });

afterEach(() => {
  cleanup();
});
