/**
 * Terms of the IAPWS-IF97 Region 1 dimensionless Gibbs free energy
 * γ(π, τ) = Σ n_i·(7.1 − π)^I_i·(τ − 1.222)^J_i, i = 1…34, one row [I_i, J_i, n_i] per
 * term in the order of the release.
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997
 * for the Thermodynamic Properties of Water and Steam, Table 2.
 */
// prettier-ignore
export const REGION1_TERMS: readonly (readonly [number, number, number])[] = [
  [ 0,  -2, 0.14632971213167],
  [ 0,  -1, -0.84548187169114],
  [ 0,   0, -0.37563603672040e1],
  [ 0,   1, 0.33855169168385e1],
  [ 0,   2, -0.95791963387872],
  [ 0,   3, 0.15772038513228],
  [ 0,   4, -0.16616417199501e-1],
  [ 0,   5, 0.81214629983568e-3],
  [ 1,  -9, 0.28319080123804e-3],
  [ 1,  -7, -0.60706301565874e-3],
  [ 1,  -1, -0.18990068218419e-1],
  [ 1,   0, -0.32529748770505e-1],
  [ 1,   1, -0.21841717175414e-1],
  [ 1,   3, -0.52838357969930e-4],
  [ 2,  -3, -0.47184321073267e-3],
  [ 2,   0, -0.30001780793026e-3],
  [ 2,   1, 0.47661393906987e-4],
  [ 2,   3, -0.44141845330846e-5],
  [ 2,  17, -0.72694996297594e-15],
  [ 3,  -4, -0.31679644845054e-4],
  [ 3,   0, -0.28270797985312e-5],
  [ 3,   6, -0.85205128120103e-9],
  [ 4,  -5, -0.22425281908000e-5],
  [ 4,  -2, -0.65171222895601e-6],
  [ 4,  10, -0.14341729937924e-12],
  [ 5,  -8, -0.40516996860117e-6],
  [ 8, -11, -0.12734301741641e-8],
  [ 8,  -6, -0.17424871230634e-9],
  [21, -29, -0.68762131295531e-18],
  [23, -31, 0.14478307828521e-19],
  [29, -38, 0.26335781662795e-22],
  [30, -39, -0.11947622640071e-22],
  [31, -40, 0.18228094581404e-23],
  [32, -41, -0.93537087292458e-25],
];

/** Reduced-variable origin of the Region 1 series: π is taken from 7.1, τ from 1.222. */
export const REGION1_PI_SHIFT = 7.1;
export const REGION1_TAU_SHIFT = 1.222;

/** Reducing constants of Region 1: p* = 16.53 MPa, T* = 1386 K. */
export const REGION1_REDUCING_PRESSURE_PA = 16.53e6;
export const REGION1_REDUCING_TEMPERATURE_K = 1386;
