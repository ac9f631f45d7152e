// Binding a receiver to a transmitter again can reset what the unit stores: on many
// units a new bind clears or re-captures the failsafes, and some reset the output map or
// telemetry too. Common practice, no published source: units differ, so the settings
// are checked again after every bind rather than trusted from before it.

/** Said beside a unit's stored settings: the reuse check's view and the field sheet's unit line. */
export const REBIND_NOTE =
  'Re-binding a unit can clear its stored settings (failsafes especially): check the settings listed here again after binding.';

/** The same for the field sheet, which lists the slot's pins rather than the unit's settings. */
export const REBIND_NOTE_SHEET =
  'Re-binding can clear the unit’s stored settings: check its pins and failsafes against this sheet after binding.';
