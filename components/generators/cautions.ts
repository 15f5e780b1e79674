import type { Caution } from '../../shared/safety';

/**
 * Which of the usual cautions go beside each generator: every part here is routed, the jigs are
 * used on a saw, and the charger insert also carries a charger and a cord to a wall socket.
 */
const BY_GENERATOR: Record<string, Caution['id'][]> = {
  'charger-insert': ['router', 'charger', 'mains', 'dust'],
  'taper-jig': ['saw', 'router', 'dust'],
  'splayed-box': ['saw', 'router', 'dust'],
  'half-lap': ['saw', 'router', 'dust'],
};

export function cautionsForGenerator(id: string): Caution['id'][] {
  return BY_GENERATOR[id] ?? ['router', 'saw', 'dust'];
}
