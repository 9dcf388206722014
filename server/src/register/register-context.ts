/**
 * The one place the server decides which rules a scaffold is inspected under: the site's
 * jurisdiction (regulation references, pass criteria) and the regime (the scaffold's own, else the
 * site's).
 */
import { effectiveRegime, type InspectionRegime, type Jurisdiction, type LiftHeightSource, topPlatformHeightM } from '@plummet/shared';

export interface RegisterContext {
  jurisdiction: Jurisdiction;
  regime: InspectionRegime;
  timeZone: string;
}

export function registerContextOf(
  site: { regime: InspectionRegime; timeZone: string; jurisdiction?: Jurisdiction | null },
  scaffold: { id: string; regime?: InspectionRegime | null },
): RegisterContext {
  return {
    jurisdiction: site.jurisdiction ?? 'uk',
    regime: effectiveRegime(site.regime, scaffold.regime ?? null),
    timeZone: site.timeZone,
  };
}

/** Height of the top working platform above the ground, m: the top of the last lift, lift by lift. */
export function topWorkingHeightOf(scaffold: LiftHeightSource): number {
  return topPlatformHeightM(scaffold);
}
