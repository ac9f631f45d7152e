import { useCallback, useState, type RefObject } from 'react';
import { noFormErrors, type FormErrors } from '../lib/form-errors';
import { useFocusFirstInvalid } from './use-focus-first-invalid';

/**
 * The messages a form shows after a refused submit. `refuse` shows them and moves focus
 * to the first field marked invalid (each refusal counts, so a second one with the same
 * messages still moves focus); `clear` takes them away before the form tries again.
 */
export function useFormErrors(form: RefObject<HTMLFormElement | null>) {
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [attempt, setAttempt] = useState(0);
  useFocusFirstInvalid(form, attempt);

  const refuse = useCallback((next: FormErrors) => {
    setErrors(next);
    setAttempt((n) => n + 1);
  }, []);
  const clear = useCallback(() => setErrors(noFormErrors), []);

  return { errors, refuse, clear };
}
