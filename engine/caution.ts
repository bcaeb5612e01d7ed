// The caution carried by the app, the printout, the command line and the README.

export const CAUTION =
  'Loopwright is a design aid. Its results do not replace verification: every installation must be ' +
  'inspected and tested (including measured earth-fault loop impedance) before it is put into service, ' +
  'and local wiring rules and licensed practice govern.';
