import type { Ring } from "./geometry";

const TOKEN = /([MmLlHhVvZz])|([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)/g;

/**
 * Rings of path data made of straight lines only (M, L, H, V, Z, absolute or relative, with implicit repeats),
 * read directly: such data has nothing to flatten, and paper.js takes about 10 ms per 1000 points to find that
 * out. Returns null when the data holds a curve or an arc (paper.js flattens those). Call only on data that
 * passed `pathDataErrorAt`. Each M starts a ring; the closing point is not repeated.
 */
export function polylineRings(d: string): Ring[] | null {
  if (/[CcSsQqTtAa]/.test(d)) return null;
  const rings: Ring[] = [];
  let ring: Array<[number, number]> = [];
  let x = 0;
  let y = 0;
  let startX = 0;
  let startY = 0;
  let command = "";
  let args: number[] = [];
  /** After Z, a drawing command other than M starts a new ring at the closed ring's first point (SVG 1.1, 8.3.3). */
  let reopen = false;
  const flush = () => {
    if (ring.length >= 2) {
      const [fx, fy] = ring[0];
      const [lx, ly] = ring[ring.length - 1];
      if (fx === lx && fy === ly) ring.pop();
    }
    if (ring.length >= 3) rings.push(ring);
    ring = [];
  };
  const run = () => {
    const relative = command === command.toLowerCase();
    const c = command.toLowerCase();
    if (c === "z") {
      x = startX;
      y = startY;
      flush();
      reopen = true;
      return;
    }
    const step = c === "h" || c === "v" ? 1 : 2;
    for (let k = 0; k + step <= args.length; k += step) {
      if (c === "h") x = relative ? x + args[k] : args[k];
      else if (c === "v") y = relative ? y + args[k] : args[k];
      else {
        x = relative ? x + args[k] : args[k];
        y = relative ? y + args[k + 1] : args[k + 1];
      }
      if (c === "m" && k === 0) {
        flush();
        startX = x;
        startY = y;
      } else if (reopen) ring.push([startX, startY]);
      reopen = false;
      ring.push([x, y]);
    }
  };
  for (const [, letter, number] of d.matchAll(TOKEN)) {
    if (letter) {
      if (command) run();
      command = letter;
      args = [];
    } else args.push(Number(number));
  }
  if (command) run();
  flush();
  return rings;
}
