import { z } from 'zod';

/** What every saved revision records about its drawing, in millimetres. */
export const GeometrySummary = z.object({
  units: z.literal('mm'),
  extents: z.object({ minX: z.number(), minY: z.number(), maxX: z.number(), maxY: z.number(), width: z.number(), height: z.number() }),
  /** Area enclosed by the outermost closed contour(s), minus holes, mm². */
  area: z.number(),
  /** Sum of the lengths of every path, mm. */
  perimeter: z.number(),
  closedContours: z.number().int(),
  openContours: z.number().int(),
  /** Path count per layer (operation), e.g. { outline: 4, pocket: 8 }. */
  layers: z.record(z.string(), z.number().int()),
  /** Named features a generator reports (pocket sizes…), mm. */
  features: z.record(z.string(), z.object({ width: z.number(), height: z.number(), depth: z.number().optional() })).optional(),
});
export type GeometrySummary = z.infer<typeof GeometrySummary>;

/** Operation layers: what the router does along a path. Generators and imports use these names. */
export const LAYERS = ['outline', 'pocket', 'recess', 'channel', 'relief', 'marks', 'guide'] as const;
export type LayerName = (typeof LAYERS)[number];
