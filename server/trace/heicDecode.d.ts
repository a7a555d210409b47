declare module 'heic-decode' {
  /** Decodes the main image of a HEIC file to RGBA bytes. */
  export default function decode(options: { buffer: Buffer | ArrayBuffer }): Promise<{ width: number; height: number; data: Uint8ClampedArray }>;
}
