import { useCallback, useState } from 'react';
import type { TankFormField, TankFormValues } from '@/components/tanks/tank-form-model';

/** The tank form's values and messages; editing a field clears only its own message. */
export function useTankForm(initial: () => TankFormValues) {
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<Partial<Record<TankFormField, string>>>({});
  const [banner, setBanner] = useState<string | null>(null);
  const set = useCallback(
    <K extends TankFormField>(key: K) =>
      (value: TankFormValues[K]) => {
        setValues((prev) => ({ ...prev, [key]: value }));
        setErrors((prev) => {
          if (!(key in prev)) return prev;
          const { [key]: _cleared, ...rest } = prev;
          return rest;
        });
        setBanner(null);
      },
    [],
  );
  return { values, setValues, set, errors, setErrors, banner, setBanner };
}
