import '@testing-library/jest-dom/vitest';
import { cleanup, configure } from '@testing-library/react';
import { afterEach } from 'vitest';
import { forgetKitchen } from '@/lib/kitchen-choice';

// jsdom has no matchMedia; Chakra's responsive styles ask for it.
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
  // Every test starts in a browser where no kitchen was chosen.
  forgetKitchen();
  window.localStorage.clear();
});
