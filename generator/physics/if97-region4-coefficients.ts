/**
 * Coefficients n1…n10 of the IAPWS-IF97 saturation-pressure equation (Region 4).
 * Source: IAPWS R7-97(2012), Revised Release on the IAPWS Industrial Formulation 1997
 * for the Thermodynamic Properties of Water and Steam, Table 34.
 */
export const REGION4_N = {
  n1: 0.11670521452767e4,
  n2: -0.72421316703206e6,
  n3: -0.17073846940092e2,
  n4: 0.1202082470247e5,
  n5: -0.32325550322333e7,
  n6: 0.1491510861353e2,
  n7: -0.48232657361591e4,
  n8: 0.40511340542057e6,
  n9: -0.23855557567849,
  n10: 0.65017534844798e3,
} as const;
