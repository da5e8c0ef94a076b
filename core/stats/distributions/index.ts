export { logGamma } from './log-gamma';
export { regularizedGammaP, regularizedGammaQ } from './regularized-gamma';
export { regularizedBeta } from './regularized-beta';
export { normalCdf, normalSf, normalQuantile } from './normal';
export { chiSquareSf } from './chi-square';
export { poissonCdf, poissonSf } from './poisson';
export { binomialCdf, binomialSf } from './binomial';
export { studentTCdf, studentTTwoSided } from './student-t';
