import { useMutation } from '@tanstack/react-query';
import { db } from '../../local-db/db';
import { changeUnits, changeWindUnits } from '../auth/session.store';
import type { Units, WindUnits } from '../../lib/units';

export function useChangeUnitsMutation() {
  return useMutation({
    mutationFn: (units: Units) => changeUnits(db, units),
    meta: { errorToast: 'The units could not be changed on this phone.' },
  });
}

export function useChangeWindUnitsMutation() {
  return useMutation({
    mutationFn: (windUnits: WindUnits) => changeWindUnits(db, windUnits),
    meta: { errorToast: 'The wind unit could not be changed on this phone.' },
  });
}
