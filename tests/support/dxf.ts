// Hand-written DXF R12 text for tests, following the Autodesk DXF Reference: HEADER ($INSUNITS,
// group 70: 1 inches, 4 millimeters), ENTITIES (LINE 10/20–11/21, ARC 10/20 centre, 40 radius,
// 50/51 angles in degrees counter-clockwise, LWPOLYLINE 90 count, 70 flags (1 closed), 42 bulge).
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export function dxfFile(entities: string[], insunits: number | null = 4): string {
  const header = insunits === null ? '' : `0\nSECTION\n2\nHEADER\n9\n$ACADVER\n1\nAC1009\n9\n$INSUNITS\n70\n${insunits}\n0\nENDSEC\n`;
  return `${header}0\nSECTION\n2\nENTITIES\n${entities.join('')}0\nENDSEC\n0\nEOF\n`;
}

export const line = (x1: number, y1: number, x2: number, y2: number, layer = '0') =>
  `0\nLINE\n8\n${layer}\n10\n${x1}\n20\n${y1}\n30\n0\n11\n${x2}\n21\n${y2}\n31\n0\n`;

export const arc = (cx: number, cy: number, r: number, a0: number, a1: number, layer = '0') =>
  `0\nARC\n8\n${layer}\n10\n${cx}\n20\n${cy}\n30\n0\n40\n${r}\n50\n${a0}\n51\n${a1}\n`;

export const circle = (cx: number, cy: number, r: number, layer = '0') => `0\nCIRCLE\n8\n${layer}\n10\n${cx}\n20\n${cy}\n30\n0\n40\n${r}\n`;

/** A closed rectangle w × h at the origin, as four LINEs. */
export const rectLines = (w: number, h: number, layer = '0') => [line(0, 0, w, 0, layer), line(w, 0, w, h, layer), line(w, h, 0, h, layer), line(0, h, 0, 0, layer)];

/** Runs Debian's ezdxf auditor on DXF text; returns its output (throws when it finds errors). */
export function ezdxfAudit(text: string): string {
  const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'jw-dxf-')), 'audit.dxf');
  fs.writeFileSync(file, text);
  try {
    return execFileSync('/usr/bin/python3', ['-m', 'ezdxf', 'audit', file], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } finally {
    fs.rmSync(path.dirname(file), { recursive: true, force: true });
  }
}
