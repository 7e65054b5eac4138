/** The closing map's layers and their names (one wording for the chart, its caption and the select). */
export type MapLayer = 'surge' | 'torque' | 'peak-torque';

export const MAP_LAYER_LABEL: Record<MapLayer, string> = {
  surge: 'surge current (pu of rated)',
  torque: 'torque step, (E1 E2 / X) sin θ (|pu| of rated)',
  'peak-torque': 'peak air-gap torque in the first cycle, with the DC offset (|pu| of rated)',
};
