export * from './homography';
export * from './otsu';
export * from './calibration';
export * from './dominantQuad';
