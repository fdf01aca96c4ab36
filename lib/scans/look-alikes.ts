// How close two scans' perceptual hashes must be to count as look-alikes. No imports: the browser reads these too.

/**
 * Farthest distance shown as a look-alike. Two unrelated 64-bit hashes differ in about half their bits
 * (32 ± 4, binomial 64 × ½), so a match must be clearly closer than chance. Measured on the invented demo art
 * (db/seed/scan-art.ts, tests/unit/scans/look-alikes.test.ts): a motif without mirror symmetry scanned again, smaller, as JPEG
 * or at another DPI stays within 8 bits, a mirror twin within 2 (mirrored), motifs of different families
 * stay 16 or more apart. 12 bits keeps 4 bits of margin on either side.
 * Motifs that are mirror-symmetric hash noisily (see dctHash) and may not be found at all; better a gap than noise.
 */
export const LOOK_ALIKE_MAX_BITS = 12;

/**
 * A match counts as a mirror twin only when its mirrored comparison is at least this much closer than its
 * straight one. A twin's straight comparison is as far as chance (about 32), so the gap is wide; a symmetric
 * motif matches both ways about alike and is no twin.
 */
export const MIRROR_TWIN_MARGIN_BITS = 8;
