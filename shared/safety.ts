// The usual cautions for the work Jigwright supports. Shown beside generators, on printed
// templates and on the safety page. Sources: OSHA 29 CFR 1910.212/1910.213 and OSHA 3157 for
// machine work; fire-service guidance for chargers. Always defer to the manufacturer and local codes.
export interface Caution {
  id: 'router' | 'saw' | 'charger' | 'mains' | 'dust';
  title: string;
  points: string[];
}

export const CAUTIONS: Caution[] = [
  {
    id: 'router',
    title: 'Router and CNC',
    points: [
      'Follow the machine and bit makers’ instructions for speed, feed and depth per pass.',
      'Clamp or screw the workpiece and any template down; check that hold-downs are clear of the tool path.',
      'Wear eye and hearing protection; keep hands away from the bit and never reach over a running spindle.',
      'Stay with a running CNC job and know where its emergency stop is.',
      'Cut a test piece in cheap stock before the good material.',
    ],
  },
  {
    id: 'saw',
    title: 'Table saw and jigs',
    points: [
      'Use the blade guard, riving knife and push sticks the saw maker supplies.',
      'Stand out of the kickback line; never cut freehand against the fence.',
      'Check a sled or taper jig rides true before the first cut, with the saw unplugged.',
    ],
  },
  {
    id: 'charger',
    title: 'Chargers inside furniture',
    points: [
      'Use the charger only as its maker instructs; their stated charging distance and heat limits win over any number here.',
      'Leave air around the pad and keep the power adapter outside the cavity, where it can cool.',
      'Keep metal (screws, plates, foil) out of the charging area.',
      'Never bury cords or adapters under insulation, rugs or closed panels.',
    ],
  },
  {
    id: 'mains',
    title: 'Mains wiring',
    points: [
      'Use plug-in, certified power supplies; do not wire mains voltage into furniture yourself.',
      'Any fixed wiring must follow local electrical codes and be done by a licensed electrician.',
    ],
  },
  {
    id: 'dust',
    title: 'Dust and finish',
    points: ['Collect dust at the source and wear a suitable respirator; some wood dusts are sensitisers.'],
  },
];

export function cautionsFor(ids: Caution['id'][]): Caution[] {
  return CAUTIONS.filter((c) => ids.includes(c.id));
}
