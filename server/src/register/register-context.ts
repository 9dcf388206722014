/**
 * The one place the server decides which rules a scaffold is inspected under: the site's
 * jurisdiction (regulation references, pass criteria) and the regime (the scaffold's own, else the
 * site's). Sites do not store a jurisdiction yet, nor scaffolds a regime of their own: until they
 * do, every site reads as UK and every scaffold follows its site. Wire the new columns here.
 */
import { effectiveRegime, type InspectionRegime, type Jurisdiction } from '@plummet/shared';

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

/**
 * Height of the top working platform above the ground, m: the top of the last lift. Scaffolds hold
 * one lift height for now; with a height per lift, sum them here.
 */
export function topWorkingHeightOf(scaffold: { lifts: number; liftHeightM: number }): number {
  return scaffold.lifts * scaffold.liftHeightM;
}
