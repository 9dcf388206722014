/**
 * The expected end of a convergence schedule, worked out here from the rules as the product states
 * them, without calling the merge or state code under test: the mutations each phone sent (as
 * captured on the wire), taken in the order the server logged them, applied to a plain model.
 *
 * - A field without a safety rule takes the later write (lift, the inspection's location).
 * - When a write clashes with a value its writer had not seen (the server keeps a conflict for it),
 *   the more restrictive value stands: the greater height, the stronger wind, a failed control
 *   (BRIEF: safety first); clashing notes keep both texts.
 * - A finding moves open → made safe → fixed → verified, and fixed or verified back to open
 *   (BRIEF, "finding states"): foremen make safe and fix, inspectors do everything, and whoever fixed
 *   it cannot verify it. Asking for the state it is in changes nothing, if the role could move it there.
 * - Only inspectors record and edit findings; a foreman's edit is refused.
 *
 * The model predicts every state change's outcome and checks each logged one against it; for edits
 * it takes from the server only *whether* a clash happened (a conflict row), and checks that a clash
 * never involves a field last written by the same phone, and that each conflict's value in place is
 * the one the model holds after that write.
 */
import type { SentMutation } from './sync-harness.js';

export type Role = 'inspector' | 'foreman';

export interface LoggedMutation {
  clientId: string;
  mutationId: number;
  entity: string;
  entityId: string;
  action: string;
  outcome: 'applied' | 'conflict' | 'rejected';
}

export interface LoggedConflict {
  winnerClientId: string;
  mutationId: number;
  field: string;
  currentValue: unknown;
}

export interface Sender {
  role: Role;
  userId: string;
}

export interface ModelFinding {
  notes: string;
  heightM: number;
  lift: number;
  state: string;
}

export interface ModelWalk {
  location: string;
  windSpeedMps: number;
  checks: Record<string, { result: string; note: string }>;
}

type Moves = Record<Role, readonly (readonly [string, string])[]>;
/** BRIEF, finding states: who may make which move (a manager's moves are not exercised here). */
const MOVES: Moves = {
  inspector: [
    ['open', 'made-safe'],
    ['open', 'fixed'],
    ['made-safe', 'fixed'],
    ['fixed', 'verified'],
    ['fixed', 'open'],
    ['verified', 'open'],
  ],
  foreman: [
    ['open', 'made-safe'],
    ['open', 'fixed'],
    ['made-safe', 'fixed'],
  ],
};

/** Two texts written apart: neither is lost (one that already holds the other is kept as it is). */
function keepBoth(current: string, incoming: string): string {
  const [a, b] = [current.trim(), incoming.trim()];
  if (!a || b.includes(a)) return b;
  if (!b || a.includes(b)) return a;
  return `${a}\n\n${b}`;
}

const SAFER: Record<string, (current: unknown, incoming: unknown) => unknown> = {
  heightM: (c, i) => Math.max(Number(c), Number(i)),
  windSpeedMps: (c, i) => Math.max(Number(c), Number(i)),
  result: (c, i) => (c === 'fail' || i === 'fail' ? 'fail' : i),
};
const BOTH_TEXTS = new Set(['notes', 'note']);

interface Fields {
  values: Record<string, unknown>;
  /** The client that last wrote each field. */
  writer: Record<string, string>;
}

export interface ModelOutcome {
  findings: Map<string, ModelFinding>;
  walk: ModelWalk;
  /** Every place where the server's log disagrees with the rules. */
  problems: string[];
}

export function expectedEndState(input: {
  log: LoggedMutation[];
  sent: Map<string, SentMutation>;
  senders: Map<string, Sender>;
  conflicts: LoggedConflict[];
}): ModelOutcome {
  const problems: string[] = [];
  const findings = new Map<string, Fields & { state: string; fixer: string | null }>();
  let walk: Fields | undefined;
  const checks = new Map<string, Fields>();
  const clashes = new Map<string, LoggedConflict>();
  for (const c of input.conflicts) clashes.set(`${c.winnerClientId}:${c.mutationId}:${c.field}`, c);

  /** One write of a field: the later value, or on a clash the safer one or both texts. */
  const write = (record: Fields, key: string, clientId: string, field: string, incoming: unknown) => {
    const current = record.values[field];
    if (JSON.stringify(current) === JSON.stringify(incoming)) return;
    const clash = clashes.get(`${key}:${field}`);
    let value = incoming;
    if (clash) {
      if (record.writer[field] === clientId) problems.push(`${key} ${field}: a conflict with its own earlier write`);
      if (SAFER[field]) value = SAFER[field](current, incoming);
      else if (BOTH_TEXTS.has(field)) value = keepBoth(String(current ?? ''), String(incoming ?? ''));
    }
    if (JSON.stringify(value) !== JSON.stringify(current)) {
      record.values[field] = value;
      record.writer[field] = clientId;
    } else if (BOTH_TEXTS.has(field)) record.writer[field] = clientId;
    if (clash && JSON.stringify(clash.currentValue) !== JSON.stringify(record.values[field])) {
      problems.push(`${key} ${field}: the conflict keeps ${JSON.stringify(clash.currentValue)} in place, the rules ${JSON.stringify(record.values[field])}`);
    }
  };
  const fresh = (values: Record<string, unknown>, clientId: string): Fields => ({ values: { ...values }, writer: Object.fromEntries(Object.keys(values).map((f) => [f, clientId])) });

  for (const row of input.log) {
    const key = `${row.clientId}:${row.mutationId}`;
    const sent = input.sent.get(key);
    const who = input.senders.get(row.clientId);
    if (!sent || !who) {
      problems.push(`${key}: logged by the server but never sent by a phone`);
      continue;
    }
    if (sent.entity !== row.entity || sent.entityId !== row.entityId || sent.action !== row.action) problems.push(`${key}: logged as another mutation`);
    const expect = (outcomes: string[], why: string) => {
      if (!outcomes.includes(row.outcome)) problems.push(`${key} ${sent.entity} ${sent.action} by the ${who.role}: ${row.outcome}, expected ${outcomes.join(' or ')} (${why})`);
    };
    const p = sent.payload;

    if (sent.entity === 'finding' && sent.action === 'create') {
      expect(who.role === 'inspector' ? ['applied'] : ['rejected'], 'only inspectors record findings');
      if (row.outcome === 'applied' && !findings.has(sent.entityId)) {
        findings.set(sent.entityId, { ...fresh({ notes: p.notes ?? '', heightM: p.heightM, lift: p.lift }, row.clientId), state: 'open', fixer: null });
      }
    } else if (sent.entity === 'finding' && sent.action === 'update') {
      expect(who.role === 'inspector' ? ['applied', 'conflict'] : ['rejected'], 'only inspectors edit findings');
      const finding = findings.get(sent.entityId);
      if (row.outcome !== 'rejected' && finding) for (const [field, value] of Object.entries(p)) write(finding, key, row.clientId, field, value);
    } else if (sent.entity === 'finding' && sent.action === 'state') {
      const finding = findings.get(sent.entityId);
      if (!finding) continue;
      const to = String(p.to);
      const reachable = MOVES[who.role].some(([, end]) => end === to);
      const move = MOVES[who.role].some(([from, end]) => from === finding.state && end === to);
      const fixerVerifies = to === 'verified' && finding.fixer === who.userId;
      const allowed = finding.state === to ? reachable : move && !fixerVerifies;
      expect(allowed ? ['applied'] : ['rejected'], `from ${finding.state} to ${to}${fixerVerifies ? ', by its fixer' : ''}`);
      if (row.outcome === 'applied') {
        if (to === 'fixed' && finding.state !== 'fixed') finding.fixer = who.userId;
        finding.state = to;
      }
    } else if (sent.entity === 'inspection' && sent.action === 'create') {
      expect(['applied'], 'the inspector starts the walk');
      if (row.outcome === 'applied' && !walk) walk = fresh({ location: '', windSpeedMps: p.windSpeedMps }, row.clientId);
    } else if (sent.entity === 'inspection' && sent.action === 'update') {
      expect(who.role === 'inspector' ? ['applied', 'conflict'] : ['rejected'], 'the inspector edits the walk');
      if (row.outcome !== 'rejected' && walk) for (const [field, value] of Object.entries(p)) write(walk, key, row.clientId, field, value);
    } else if (sent.entity === 'control-check' && sent.action === 'put') {
      expect(who.role === 'inspector' ? ['applied', 'conflict'] : ['rejected'], 'the inspector answers the controls');
      if (row.outcome === 'rejected') continue;
      const control = String(p.control);
      const check = checks.get(control);
      if (!check) checks.set(control, fresh({ result: p.result, note: p.note ?? '' }, row.clientId));
      else for (const field of ['result', 'note'] as const) if (p[field] !== undefined) write(check, key, row.clientId, field, p[field]);
    } else {
      problems.push(`${key}: ${sent.entity} ${sent.action} is not part of the schedules`);
    }
  }

  return {
    findings: new Map([...findings].map(([id, f]) => [id, { notes: String(f.values.notes), heightM: Number(f.values.heightM), lift: Number(f.values.lift), state: f.state }])),
    walk: {
      location: String(walk?.values.location ?? ''),
      windSpeedMps: Number(walk?.values.windSpeedMps),
      checks: Object.fromEntries([...checks].map(([control, c]) => [control, { result: String(c.values.result), note: String(c.values.note) }])),
    },
    problems,
  };
}
