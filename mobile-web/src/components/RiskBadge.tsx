import type { RiskBand } from '@plummet/shared';
import './RiskBadge.css';

interface RiskBadgeProps {
  band: RiskBand;
  score?: number;
  /** Compact: the band word only (grid pins). */
  compact?: boolean;
}

/** The risk band as colour AND words ("High risk 16"), never colour alone. */
export function RiskBadge({ band, score, compact }: RiskBadgeProps) {
  return (
    <span className={`risk-badge risk-badge--${band.toLowerCase()} ${compact ? 'risk-badge--compact' : ''}`} data-band={band}>
      {compact ? band : `${band} risk${score !== undefined ? ` ${score}` : ''}`}
    </span>
  );
}
