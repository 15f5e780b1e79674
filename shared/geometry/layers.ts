import type { LayerName } from '../schemas/geometry';

/**
 * How each operation layer is drawn: Jigwright's own palette and line patterns, chosen so the
 * layers still read apart in greyscale (different weights and dash rhythms, not colour alone).
 */
export const LAYER_STYLE: Record<LayerName, { label: string; stroke: string; width: number; dash?: string; fill?: string }> = {
  outline: { label: 'Through cut', stroke: '#1F2421', width: 1.6 },
  pocket: { label: 'Pocket (top)', stroke: '#2F6B4F', width: 1.2, dash: '6 3', fill: 'rgba(47,107,79,0.10)' },
  recess: { label: 'Underside recess', stroke: '#B8652A', width: 1.2, dash: '2 2', fill: 'rgba(184,101,42,0.10)' },
  channel: { label: 'Cord channel', stroke: '#5B4B8A', width: 1.2, dash: '8 2 2 2' },
  relief: { label: 'Corner relief', stroke: '#A83A2A', width: 1.0 },
  marks: { label: 'Alignment marks', stroke: '#5A625D', width: 0.8, dash: '1 3' },
  guide: { label: 'Layout guide', stroke: '#8C8C8C', width: 0.6, dash: '4 4' },
};
