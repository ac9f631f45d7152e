import { useEffect, type RefObject } from 'react';

/**
 * After a refused submit, moves focus to the first field marked invalid so keyboard
 * and screen-reader users land on the message; `attempt` changes once per submit.
 */
export function useFocusFirstInvalid(form: RefObject<HTMLFormElement | null>, attempt: number): void {
  useEffect(() => {
    if (attempt === 0) return;
    form.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus();
  }, [form, attempt]);
}
