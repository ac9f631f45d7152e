import { useCallback, useState } from 'react';

/**
 * Local state that takes every new value of `source`. A control whose value lives in
 * the address shows a click at once with it: the router brings the address round in a
 * transition, a moment later, and the control would show the old value until then.
 * When the address changes otherwise (back, a link, another button) the control follows it.
 */
export function useFollowingState<T>(source: T): [T, (value: T) => void] {
  const [state, setState] = useState({ source, value: source });
  const set = useCallback((value: T) => setState((current) => ({ source: current.source, value })), []);
  // A new source value wins over what was set before it (React's way of adjusting state to a changed prop).
  if (!Object.is(state.source, source)) {
    setState({ source, value: source });
    return [source, set];
  }
  return [state.value, set];
}
