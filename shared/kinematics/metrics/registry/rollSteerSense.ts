/** What positive roll steer means at each end of the vehicle (the roll sweep's and the heave rows' roll steer alike). */
export const ROLL_STEER_AXLE_SENSE = {
  rear:
    'On a rear axle positive is roll oversteer: the body rolls out of a turn, ' +
    'and the axle then steers toward the outside of the turn.',
  front:
    'On a front axle positive is roll understeer: the body rolls out of a turn, and the axle then ' +
    'steers toward the outside of the turn.',
} as const;
