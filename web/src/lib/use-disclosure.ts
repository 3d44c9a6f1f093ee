import { useId, useRef, useState, type KeyboardEvent } from 'react';

/**
 * A button that shows and hides a panel below it: the button says whether the panel is open and
 * which it is; Escape in the panel closes it and puts focus back on the button.
 */
export function useDisclosure() {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const buttonRef = useRef<HTMLButtonElement>(null);

  function close() {
    setOpen(false);
    buttonRef.current?.focus();
  }

  return {
    open,
    setOpen,
    close,
    buttonProps: {
      ref: buttonRef,
      'aria-expanded': open,
      'aria-controls': panelId,
      onClick: () => setOpen((value) => !value),
    },
    panelProps: {
      id: panelId,
      hidden: !open,
      onKeyDown: (event: KeyboardEvent) => {
        if (event.key !== 'Escape') return;
        event.preventDefault();
        close();
      },
    },
  };
}
