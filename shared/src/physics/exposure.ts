/** Who is struck below: a bare head (public, anyone without head protection) or a worker in a helmet. */
export type Exposure = 'bare-head' | 'helmet';

export const EXPOSURES: readonly Exposure[] = ['bare-head', 'helmet'];
