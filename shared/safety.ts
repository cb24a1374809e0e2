// README §Safety: every results page, calculation sheet and results download carries this note.
export const SAFETY_NOTE =
  "Stanchion's results are a design aid. The design must be checked by a competent engineer against the National Annex and the regulations in force where the building is. Braced (non-sway) frames only; fire, seismic actions and connections are outside its scope.";
