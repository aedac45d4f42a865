import { useCallback, useState } from 'react';
import { NO_FORM_ERRORS, type FormErrors } from '@/lib/form-errors';

/**
 * Text values and error messages of one form. Editing a field clears that field's message
 * (and the banner) but never touches what the person typed elsewhere.
 */
export function useFormState<K extends string>(initial: Record<K, string>) {
  const [values, setValues] = useState(initial);
  const [errors, setErrors] = useState<FormErrors>(NO_FORM_ERRORS);

  const setValue = useCallback(
    (key: K) => (text: string) => {
      setValues((prev) => ({ ...prev, [key]: text }));
      setErrors((prev) => {
        if (!(key in prev.fields) && prev.banner === null) return prev;
        const { [key]: _cleared, ...rest } = prev.fields;
        return { fields: rest, banner: null };
      });
    },
    [],
  );

  return { values, setValue, errors, setErrors };
}
