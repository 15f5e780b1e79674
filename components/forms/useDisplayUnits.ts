import { useCallback, useEffect, useState } from 'react';

/** The unit lengths are shown and typed in. Stored values are always millimetres. */
export type DisplayUnits = 'mm' | 'in';

const STORAGE_KEY = 'jigwright.displayUnits';

function readStored(): DisplayUnits | null {
  try {
    // localStorage exists only on web; the app targets web, but stay safe when it is missing or blocked.
    const v = typeof localStorage !== 'undefined' ? localStorage.getItem(STORAGE_KEY) : null;
    return v === 'mm' || v === 'in' ? v : null;
  } catch {
    return null;
  }
}

// Every screen using the hook follows a change made on any other screen in the same tab.
const listeners = new Set<(u: DisplayUnits) => void>();

/** The shop's chosen display unit, remembered on this browser. */
export function useDisplayUnits(): [DisplayUnits, (u: DisplayUnits) => void] {
  const [units, setUnitsState] = useState<DisplayUnits>(() => readStored() ?? 'mm');
  useEffect(() => {
    listeners.add(setUnitsState);
    return () => {
      listeners.delete(setUnitsState);
    };
  }, []);
  const setUnits = useCallback((u: DisplayUnits) => {
    try {
      if (typeof localStorage !== 'undefined') localStorage.setItem(STORAGE_KEY, u);
    } catch {
      // Private mode or storage full: the choice still holds for this visit.
    }
    listeners.forEach((l) => l(u));
  }, []);
  return [units, setUnits];
}
