/**
 * Invented demo lists for the Line matcher page (no real ion or catalogue): a level list of a fictional light
 * ion and a line list computed from it by the Ritz principle with noise of ±0.02 cm⁻¹, air wavelengths from
 * 2000 Å (Morton 2000 index), vacuum below. One strong line is left out and one unexplained line added on purpose.
 */
export const DEMO_LEVELS = `energy,J,parity,term,label,uncertainty
0,0,even,3P,2p2 3P0,0.01
118.9,1,even,3P,2p2 3P1,0.01
322.4,2,even,3P,2p2 3P2,0.01
15840.6,2,even,1D,2p2 1D2,0.03
33702.2,0,even,1S,2p2 1S0,0.05
44269.8,0,odd,3P,2p3s 3P0,0.02
44310.35,1,odd,3P,2p3s 3P1,0.02
44405.1,2,odd,3P,2p3s 3P2,0.02
46980.2,1,odd,1P,2p3s 1P1,0.03
61210.5,1,odd,3D,2p3d 3D1,0.04
61244.9,2,odd,3D,2p3d 3D2,0.04
61301.7,3,odd,3D,2p3d 3D3,0.04`;

export const DEMO_LINES = `wavelength,unit,medium,uncertainty,intensity
2256.111,A,air,0.005,111
2127.885,A,air,0.005,19
1633.706,A,vacuum,0.005,111
2262.181,A,air,0.005,83
2264.259,A,air,0.005,111
2257.340,A,air,0.005,139
2133.284,A,air,0.005,29
1636.886,A,vacuum,0.005,83
1635.965,A,vacuum,0.005,250
2272.648,A,air,0.005,139
2267.763,A,air,0.005,417
2142.589,A,air,0.005,16
1642.357,A,vacuum,0.005,6
1641.430,A,vacuum,0.005,83
3511.494,A,air,0.005,17
3499.846,A,air,0.005,29
3210.417,A,air,0.005,1000
2203.416,A,air,0.005,33
9424.135,A,air,0.005,18
7529.186,A,air,0.005,1000
5012.345,A,air,0.005,40`;

/** The demo level list in the upload format of the project lists (src/lib/lines/uploads.ts): the same invented levels. */
export const DEMO_LEVEL_UPLOAD = `energy,uncertainty,J,parity,configuration,term
0,0.01,0,even,2p2,3P
118.9,0.01,1,even,2p2,3P
322.4,0.01,2,even,2p2,3P
15840.6,0.03,2,even,2p2,1D
33702.2,0.05,0,even,2p2,1S
44269.8,0.02,0,odd,2p3s,3P°
44310.35,0.02,1,odd,2p3s,3P°
44405.1,0.02,2,odd,2p3s,3P°
46980.2,0.03,1,odd,2p3s,1P°
61210.5,0.04,1,odd,2p3d,3D°
61244.9,0.04,2,odd,2p3d,3D°
61301.7,0.04,3,odd,2p3d,3D°`;

/** The demo line list in the upload format of the project lists: the same invented lines, with a comment column. */
export const DEMO_LINE_UPLOAD = `wavelength,unit,medium,uncertainty,intensity,comment
2256.111,A,air,0.005,111,
2127.885,A,air,0.005,19,
1633.706,A,vacuum,0.005,111,
2262.181,A,air,0.005,83,
2264.259,A,air,0.005,111,
2257.340,A,air,0.005,139,
2133.284,A,air,0.005,29,
1636.886,A,vacuum,0.005,83,
1635.965,A,vacuum,0.005,250,
2272.648,A,air,0.005,139,
2267.763,A,air,0.005,417,
2142.589,A,air,0.005,16,
1642.357,A,vacuum,0.005,6,
1641.430,A,vacuum,0.005,83,
3511.494,A,air,0.005,17,
3499.846,A,air,0.005,29,
3210.417,A,air,0.005,1000,
2203.416,A,air,0.005,33,
9424.135,A,air,0.005,18,
7529.186,A,air,0.005,1000,
5012.345,A,air,0.005,40,unidentified in the invented model`;
