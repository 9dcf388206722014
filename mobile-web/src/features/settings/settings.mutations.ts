import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import { changeUnits } from '../auth/session.store';
import type { Units } from '../../lib/units';

export function useChangeUnitsMutation() {
  return useMutation({
    mutationFn: (units: Units) => changeUnits(db, units),
    meta: { errorToast: 'The units could not be changed on this phone.' },
  });
}
