'use client';
import { useEffect, useRef } from 'react';

/**
 * For a control that goes away with the row it removes: call `remember(element)` as the removal is sent; when the
 * control unmounts (its row is gone), focus moves to the table or section that held it, so keyboard and screen-reader
 * users land on the list they were working in instead of the page body.
 */
export function useFocusListAfterRemoval() {
  const list = useRef<HTMLElement | null>(null);
  useEffect(
    () => () => {
      const target = list.current;
      if (!target?.isConnected) return;
      if (!target.hasAttribute('tabindex')) target.setAttribute('tabindex', '-1');
      target.focus();
    },
    [],
  );
  return (from: HTMLElement) => {
    list.current = from.closest<HTMLElement>('table, section');
  };
}
