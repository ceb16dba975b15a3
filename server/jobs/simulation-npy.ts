/**
 * A NumPy .npy (format 1.0) file of float32 (N, 2) — I and Q columns, little-endian, C order — written
 * into one buffer: the magic "\x93NUMPY", version 1.0, a uint16 LE header length, the header dict padded
 * with spaces to a multiple of 64 bytes and ended by '\n', then the data. Reference: NumPy Enhancement
 * Proposal 1, "A simple file format for NumPy arrays" (NEP 1), and the numpy.lib.format documentation.
 * Check: np.save of np.zeros((4, 2), '<f4') is a 128-byte header then 32 data bytes.
 */
export function npyFloat32Iq(samples: number): { bytes: Uint8Array; data: Float32Array } {
  const dict = `{'descr': '<f4', 'fortran_order': False, 'shape': (${samples}, 2), }`;
  const unpadded = 10 + dict.length + 1; // magic 6 + version 2 + length 2, dict, '\n'
  const headerBytes = Math.ceil(unpadded / 64) * 64;
  const header = dict + ' '.repeat(headerBytes - unpadded) + '\n';
  const bytes = new Uint8Array(headerBytes + samples * 8);
  bytes.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0], 0);
  new DataView(bytes.buffer).setUint16(8, header.length, true);
  for (let i = 0; i < header.length; i++) bytes[10 + i] = header.charCodeAt(i);
  // headerBytes is a multiple of 64, so the data view is aligned for Float32Array (little-endian hosts)
  return { bytes, data: new Float32Array(bytes.buffer, headerBytes, samples * 2) };
}
