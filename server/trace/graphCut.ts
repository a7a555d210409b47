import { createRequire } from 'node:module';
import type { PlaneImage } from './rectify';

/**
 * The graph cut runs on a copy of the squared photo shrunk to this many
 * pixels on its long side: OpenCV's grabCut took 3.3-4.2 s at 1000 x 750
 * with 3 iterations on this machine, and its cost grows with the pixels.
 */
export const GRAPH_CUT_SIDE_PX = 640;
/** Rounds of colour-model fitting and cutting (Rother, Kolmogorov and Blake 2004 use a handful until it settles). */
export const GRAPH_CUT_ITERATIONS = 3;

/** The few OpenCV calls the graph cut needs (the 4.5.2 package ships no types). */
interface Mat {
  data: Uint8Array;
  delete(): void;
}
interface OpenCv {
  Mat: { new (): Mat; new (rows: number, cols: number, type: number): Mat };
  Rect: new (x: number, y: number, width: number, height: number) => unknown;
  CV_8UC3: number;
  GC_INIT_WITH_RECT: number;
  GC_FGD: number;
  GC_PR_FGD: number;
  grabCut(img: Mat, mask: Mat, rect: unknown, bgd: Mat, fgd: Mat, iterations: number, mode: number): void;
}

let loading: Promise<{ cv: OpenCv }> | null = null;

/**
 * Loads OpenCV's WebAssembly build once per thread, on first use only, so
 * traces without a box and the web server never pay for it. The module is
 * a thenable that resolves to itself, so awaiting it never ends: wait for
 * its runtime instead and hand back a plain wrapper.
 */
function loadOpenCv(): Promise<{ cv: OpenCv }> {
  loading ??= new Promise((resolve, reject) => {
    try {
      const cv = createRequire(import.meta.url)('@techstark/opencv-js') as OpenCv & { onRuntimeInitialized?: () => void; Mat?: unknown };
      if (typeof cv.Mat === 'function' && typeof cv.grabCut === 'function') resolve({ cv });
      else cv.onRuntimeInitialized = () => resolve({ cv });
    } catch (err) {
      loading = null;
      reject(err);
    }
  });
  return loading;
}

/** A box in a raster's pixels. */
export interface PixelBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** The graph cut's answer on its shrunk grid: 255 for garment, 0 for board, `scale` shrunk pixels per plane pixel. */
export interface GraphCutMask {
  width: number;
  height: number;
  scale: number;
  mask: Uint8Array;
}

/** The squared photo shrunk by `scale` (nearest-area average), as 3-channel bytes. */
function shrink(plane: PlaneImage, scale: number, width: number, height: number): Uint8Array {
  const src = plane.raster;
  const out = new Uint8Array(width * height * 3);
  const step = 1 / scale;
  for (let y = 0; y < height; y++) {
    const y0 = Math.floor(y * step), y1 = Math.min(src.height, Math.max(y0 + 1, Math.floor((y + 1) * step)));
    for (let x = 0; x < width; x++) {
      const x0 = Math.floor(x * step), x1 = Math.min(src.width, Math.max(x0 + 1, Math.floor((x + 1) * step)));
      let r = 0, g = 0, b = 0, n = 0;
      for (let yy = y0; yy < y1; yy++) {
        for (let xx = x0; xx < x1; xx++) {
          const i = (yy * src.width + xx) * 3;
          r += src.data[i]!; g += src.data[i + 1]!; b += src.data[i + 2]!; n++;
        }
      }
      const o = (y * width + x) * 3;
      out[o] = r / n; out[o + 1] = g / n; out[o + 2] = b / n;
    }
  }
  return out;
}

/**
 * Separates the garment inside the framer's rough box by a graph cut
 * (GrabCut: Rother, Kolmogorov and Blake 2004). Everything outside the box
 * is board; colour mixtures for board and garment are fitted and the
 * cheapest cut between them, which also prefers short boundaries, is taken.
 * Pixels it calls certain or probable garment come back as 255.
 */
export async function graphCutInBox(plane: PlaneImage, boxPx: PixelBox): Promise<GraphCutMask> {
  const { cv } = await loadOpenCv();
  const long = plane.raster.width > plane.raster.height ? plane.raster.width : plane.raster.height;
  const scale = long > GRAPH_CUT_SIDE_PX ? GRAPH_CUT_SIDE_PX / long : 1;
  const width = Math.max(1, Math.round(plane.raster.width * scale));
  const height = Math.max(1, Math.round(plane.raster.height * scale));
  const x0 = Math.max(1, Math.floor(boxPx.x * scale)), y0 = Math.max(1, Math.floor(boxPx.y * scale));
  const x1 = Math.min(width - 1, Math.ceil((boxPx.x + boxPx.w) * scale)), y1 = Math.min(height - 1, Math.ceil((boxPx.y + boxPx.h) * scale));
  const empty: GraphCutMask = { width, height, scale, mask: new Uint8Array(width * height) };
  if (x1 - x0 < 4 || y1 - y0 < 4) return empty;
  const image = new cv.Mat(height, width, cv.CV_8UC3);
  const labels = new cv.Mat();
  const bgdModel = new cv.Mat();
  const fgdModel = new cv.Mat();
  try {
    image.data.set(shrink(plane, scale, width, height));
    cv.grabCut(image, labels, new cv.Rect(x0, y0, x1 - x0, y1 - y0), bgdModel, fgdModel, GRAPH_CUT_ITERATIONS, cv.GC_INIT_WITH_RECT);
    const mask = empty.mask;
    for (let i = 0; i < mask.length; i++) {
      const label = labels.data[i];
      mask[i] = label === cv.GC_FGD || label === cv.GC_PR_FGD ? 255 : 0;
    }
    return { width, height, scale, mask };
  } finally {
    image.delete();
    labels.delete();
    bgdModel.delete();
    fgdModel.delete();
  }
}
