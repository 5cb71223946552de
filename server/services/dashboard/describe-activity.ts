import type { AuditEvent } from '../../models';

const phrases: Record<string, string> = {
  sign_in: 'signed in',
  study_created: 'started a study',
  study_updated: 'changed a study',
  study_fitted: 'fitted a study',
  study_points_replaced: 'edited the points of a study',
  study_points_from_upload: 'took points from an uploaded file',
  study_file_uploaded: 'uploaded a raw file',
  study_submitted: 'submitted a study for review',
  study_approved: 'approved a study',
  study_returned: 'returned a study with comments',
  study_commented: 'commented on a study',
  study_revision_started: 'started a new revision of an approved study',
  compound_added: 'added a compound',
  compound_created: 'added a compound from the study form',
  compound_changed: 'changed a compound',
  compound_deleted: 'deleted a compound',
  potential_added: 'added a redox potential',
  potential_changed: 'changed a redox potential',
  lifetime_added: 'added a lifetime',
  lifetime_changed: 'changed a lifetime',
  decay_set_kept: 'kept a decay set',
  decay_set_refitted: 'refitted a decay set',
  study_lifetimes_from_decays: 'took lifetimes from decays into a study',
  study_lifetimes_refitted: 'took lifetimes from a refitted decay set into a study',
  spectrum_matrix_kept: 'kept emission spectra for the mechanism',
  spectrum_matrix_reanalysed: 'analysed emission spectra again at another band width',
  spectrum_matrix_discarded: 'discarded emission spectra',
  absorption_titration_kept: 'kept an absorption titration',
  absorption_titration_reanalysed: 'analysed an absorption titration again with new settings',
  absorption_titration_discarded: 'discarded an absorption titration',
  energy_added: 'added an E00 value',
  library_imported: 'imported compounds from a CSV file',
  lab_settings_changed: 'changed the lab settings',
  invitation_sent: 'invited someone',
  invitation_revoked: 'withdrew an invitation',
  membership_added: 'joined the lab',
  role_changed: "changed someone's role",
  member_removed: 'removed a member',
  scenario_created: 'saved a reaction scenario',
  scenario_updated: 'changed a reaction scenario',
  scenario_deleted: 'deleted a reaction scenario',
};

/**
 * An audit event in plain words, e.g. 'approved a study "Amine screen"'; unknown actions fall
 * back to their code.
 */
export function describeActivity(event: Pick<AuditEvent, 'action'>, targetName?: string): string {
  const phrase = phrases[event.action] ?? event.action.replace(/_/g, ' ');
  return targetName ? `${phrase} “${targetName}”` : phrase;
}
