// README §Safety: every results page, calculation sheet and results download carries this note.
export const SAFETY_NOTE =
  "Stanchion's results are a design aid. The design must be checked by a competent engineer against the National Annex and the regulations in force where the building is. Braced (non-sway) frames only; sway frames, fire and seismic actions are outside its scope, and of the connections only the splices, bases and ties whose checks it prints are checked, to the extent their working states.";
