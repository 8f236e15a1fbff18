import { DomainError } from '../errors.ts';
import { requireNonNegative, requireNonNegativeInteger, requirePositive } from '../input-checks.ts';
import { haversineKm, requireGeoPoint, type GeoPoint } from './haversine.ts';

/**
 * Which technician to send to a service call: near, holding the skills the call needs, and not already swamped.
 * Each part scores 0–1 and the weighted mean is the score out of 100:
 *   distance  1 / (1 + km / scaleKm)       (1 on the spot, ½ at the scale distance)
 *   load      1 − open / capacity, or 1 / (1 + open) when no capacity is set
 *   skills    share of the required skills held
 * A technician missing a required skill is excluded, or kept with a heavy penalty (score × 0.25) when asked.
 * The weights are ours, adjustable per operator; there is no published standard for this.
 */

export interface ServiceCallNeeds {
  location: GeoPoint;
  requiredSkills?: readonly string[];
}

export interface TechnicianCandidate {
  id: string;
  location: GeoPoint;
  skills: readonly string[];
  openJobs: number;
  /** Open jobs at which the technician counts as full. */
  capacity?: number;
}

export interface RankingOptions {
  missingSkill?: 'exclude' | 'penalise';
  weights?: { distance: number; load: number; skills: number };
  /** Distance at which the distance part scores ½ (default 25 km). */
  distanceScaleKm?: number;
}

export interface TechnicianRank {
  id: string;
  /** 0–100; 0 for excluded technicians. */
  score: number;
  distanceKm: number;
  excluded: boolean;
  missingSkills: string[];
  reasons: string[];
}

export const DEFAULT_WEIGHTS = { distance: 0.5, load: 0.3, skills: 0.2 };
const MISSING_SKILL_PENALTY = 0.25;

function requireSkills(skills: readonly string[], field: string): string[] {
  if (!Array.isArray(skills) || !skills.every((s) => typeof s === 'string')) {
    throw new DomainError('missing-input', `${field} must be a list of skill names`, field);
  }
  return skills.map((skill) => skill.trim().toLowerCase());
}

export function rankTechnicians(
  call: ServiceCallNeeds,
  technicians: readonly TechnicianCandidate[],
  options: RankingOptions = {},
): TechnicianRank[] {
  const callLocation = requireGeoPoint(call?.location, 'call.location');
  const required = [...new Set(requireSkills(call.requiredSkills ?? [], 'call.requiredSkills'))].filter((s) => s !== '');
  if (!Array.isArray(technicians)) throw new DomainError('missing-input', 'technicians must be a list', 'technicians');
  const weights = options.weights ?? DEFAULT_WEIGHTS;
  const wDistance = requireNonNegative(weights.distance, 'weights.distance');
  const wLoad = requireNonNegative(weights.load, 'weights.load');
  const wSkills = requireNonNegative(weights.skills, 'weights.skills');
  const totalWeight = wDistance + wLoad + wSkills;
  if (totalWeight === 0) throw new DomainError('out-of-range', 'at least one weight must be above zero', 'weights');
  const scale = options.distanceScaleKm === undefined ? 25 : requirePositive(options.distanceScaleKm, 'distanceScaleKm');
  const missingSkillPolicy = options.missingSkill ?? 'exclude';
  if (missingSkillPolicy !== 'exclude' && missingSkillPolicy !== 'penalise') {
    throw new DomainError('unknown-code', `missingSkill must be exclude or penalise (got ${String(missingSkillPolicy)})`, 'missingSkill');
  }

  const seen = new Set<string>();
  const ranks = technicians.map((tech, i): TechnicianRank => {
    const field = `technicians[${i}]`;
    if (typeof tech?.id !== 'string' || tech.id === '') throw new DomainError('missing-input', `${field} needs an id`, `${field}.id`);
    if (seen.has(tech.id)) throw new DomainError('duplicate-id', `technician ${tech.id} appears twice`, `${field}.id`);
    seen.add(tech.id);
    const location = requireGeoPoint(tech.location, `${field}.location`);
    const openJobs = requireNonNegativeInteger(tech.openJobs, `${field}.openJobs`);
    const capacity = tech.capacity === undefined ? null : requirePositive(tech.capacity, `${field}.capacity`);
    const held = new Set(requireSkills(tech.skills ?? [], `${field}.skills`));
    const missingSkills = required.filter((s) => !held.has(s));

    const distanceKm = haversineKm(callLocation, location);
    const distancePart = 1 / (1 + distanceKm / scale);
    const loadPart = capacity === null ? 1 / (1 + openJobs) : Math.max(0, 1 - openJobs / capacity);
    const skillsPart = required.length === 0 ? 1 : (required.length - missingSkills.length) / required.length;

    const reasons = [
      `${distanceKm.toFixed(1)} km away`,
      `${openJobs} open job${openJobs === 1 ? '' : 's'}${capacity === null ? '' : ` of ${capacity}`}`,
    ];
    if (capacity !== null && openJobs >= capacity) reasons.push('at capacity');
    if (required.length > 0 && missingSkills.length === 0) reasons.push(`has every skill needed (${required.join(', ')})`);
    if (missingSkills.length > 0) reasons.push(`missing skill${missingSkills.length === 1 ? '' : 's'}: ${missingSkills.join(', ')}`);

    const excluded = missingSkills.length > 0 && missingSkillPolicy === 'exclude';
    let score = (100 * (wDistance * distancePart + wLoad * loadPart + wSkills * skillsPart)) / totalWeight;
    if (missingSkills.length > 0) {
      if (excluded) {
        score = 0;
        reasons.push('excluded');
      } else {
        score *= MISSING_SKILL_PENALTY;
        reasons.push('score cut to a quarter for the missing skill');
      }
    }
    return { id: tech.id, score: Math.round(score * 10) / 10, distanceKm, excluded, missingSkills, reasons };
  });

  return ranks.sort(
    (a, b) => Number(a.excluded) - Number(b.excluded) || b.score - a.score || a.distanceKm - b.distanceKm || a.id.localeCompare(b.id),
  );
}
