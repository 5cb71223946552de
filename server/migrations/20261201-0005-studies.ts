import { DataTypes } from 'sequelize';
import type { MigrationModule } from '../db/migrator';

const id = { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 };
const labId = { type: DataTypes.UUID, allowNull: false, references: { model: 'labs', key: 'id' }, onDelete: 'CASCADE' };
const userRef = {
  type: DataTypes.UUID,
  allowNull: true,
  references: { model: 'users', key: 'id' },
  onDelete: 'SET NULL',
};
const studyRef = {
  type: DataTypes.UUID,
  allowNull: false,
  references: { model: 'studies', key: 'id' },
  onDelete: 'CASCADE',
};
const compoundRef = {
  type: DataTypes.UUID,
  allowNull: false,
  references: { model: 'compounds', key: 'id' },
  onDelete: 'RESTRICT',
};
const optionalDouble = { type: DataTypes.DOUBLE, allowNull: true };
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * Quenching studies: the study (one emitter, one quencher, one solvent), its series points,
 * the raw uploads (bytes kept as received), every fit ever made (never updated) and the review
 * thread. Values in SI-coherent units: mol/L, s, L, Pa s, K; wavelengths in nm.
 */
export const up: MigrationModule['up'] = async ({ context: queryInterface }) => {
  await queryInterface.createTable('studies', {
    id,
    lab_id: labId,
    emitter_id: compoundRef,
    quencher_id: compoundRef,
    title: { type: DataTypes.STRING(200), allowNull: false },
    solvent_id: { type: DataTypes.STRING(40), allowNull: true },
    custom_solvent_name: { type: DataTypes.STRING(80), allowNull: true },
    custom_viscosity: optionalDouble,
    temperature: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 298.15 },
    excitation_wavelength: optionalDouble,
    emission_wavelength: optionalDouble,
    window_start: optionalDouble,
    window_end: optionalDouble,
    atmosphere: { type: DataTypes.STRING(20), allowNull: false },
    degassing_method: { type: DataTypes.STRING(40), allowNull: false },
    tau0: optionalDouble,
    tau0_uncertainty: optionalDouble,
    tau0_lifetime_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'excited_state_lifetimes', key: 'id' },
      onDelete: 'SET NULL',
    },
    i0: optionalDouble,
    data_kind: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'intensity' },
    fit_model: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'linear-free' },
    dilution_correction: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    initial_volume: optionalDouble,
    stock_concentration: optionalDouble,
    stock_contains_emitter: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    inner_filter_correction: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    pinned_mechanism: { type: DataTypes.STRING(20), allowNull: true },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    owner_id: userRef,
    status: {
      type: DataTypes.ENUM('draft', 'submitted', 'approved', 'returned'),
      allowNull: false,
      defaultValue: 'draft',
    },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    previous_revision_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'studies', key: 'id' },
      onDelete: 'SET NULL',
    },
    /** False once a newer revision exists; lists show current revisions. */
    is_current: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    // Copied from the newest fit so the list can filter and sort without reading fits.
    k_sv: optionalDouble,
    kq: optionalDouble,
    flagged: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    fit_problem: { type: DataTypes.TEXT, allowNull: true },
    latest_fit_id: { type: DataTypes.UUID, allowNull: true },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    ...timestamps,
  });
  const index = (columns: string) =>
    queryInterface.sequelize.query(
      `CREATE INDEX studies_${columns.replace(/[^a-z]+/g, '_').replace(/_+$/, '')} ON studies (${columns}) WHERE is_current`,
    );
  await index('lab_id, updated_at DESC');
  for (const column of ['status', 'emitter_id', 'quencher_id', 'owner_id', 'solvent_id']) {
    await index(`lab_id, ${column}, updated_at DESC`);
  }
  await index('lab_id, kq');
  await index('lab_id, k_sv');
  await queryInterface.sequelize.query(
    'CREATE INDEX studies_lab_flagged ON studies (lab_id, updated_at DESC) WHERE is_current AND flagged',
  );
  await queryInterface.addIndex('studies', ['previous_revision_id']);
  // Text search on title and notes with ILIKE: trigram index (pg_trgm ships with PostgreSQL and is a trusted extension).
  await queryInterface.sequelize.query('CREATE EXTENSION IF NOT EXISTS pg_trgm');
  await queryInterface.sequelize.query(
    "CREATE INDEX studies_text_search ON studies USING gin ((title || ' ' || notes) gin_trgm_ops)",
  );

  await queryInterface.createTable('study_uploads', {
    id,
    lab_id: labId,
    study_id: studyRef,
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    media_type: { type: DataTypes.STRING(120), allowNull: false },
    size: { type: DataTypes.INTEGER, allowNull: false },
    sha256: { type: DataTypes.STRING(64), allowNull: false },
    content: { type: DataTypes.BLOB, allowNull: false },
    uploaded_by_id: userRef,
    parse_status: { type: DataTypes.ENUM('parsed', 'failed', 'applied'), allowNull: false },
    parse_report: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    ...timestamps,
  });
  // The same bytes twice in one study are recognised, not stored again.
  await queryInterface.addIndex('study_uploads', ['study_id', 'sha256'], { unique: true });

  await queryInterface.createTable('study_points', {
    id,
    study_id: studyRef,
    position: { type: DataTypes.INTEGER, allowNull: false },
    concentration: { type: DataTypes.DOUBLE, allowNull: false },
    intensity: optionalDouble,
    lifetime: optionalDouble,
    absorbance_excitation: optionalDouble,
    absorbance_emission: optionalDouble,
    volume_added: optionalDouble,
    uncertainty: optionalDouble,
    excluded: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    exclusion_reason: { type: DataTypes.TEXT, allowNull: true },
    upload_id: {
      type: DataTypes.UUID,
      allowNull: true,
      references: { model: 'study_uploads', key: 'id' },
      onDelete: 'SET NULL',
    },
  });
  await queryInterface.addIndex('study_points', ['study_id', 'position']);

  await queryInterface.createTable('study_fits', {
    id,
    study_id: studyRef,
    model: { type: DataTypes.STRING(20), allowNull: false },
    trigger: { type: DataTypes.STRING(20), allowNull: false },
    k_sv: optionalDouble,
    kq: optionalDouble,
    result: { type: DataTypes.JSONB, allowNull: false },
    points_used: { type: DataTypes.JSONB, allowNull: false },
    engine_version: { type: DataTypes.STRING(20), allowNull: false },
    created_by_id: userRef,
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('study_fits', ['study_id', 'created_at']);

  await queryInterface.createTable('study_reviews', {
    id,
    study_id: studyRef,
    author_id: userRef,
    action: { type: DataTypes.ENUM('submit', 'approve', 'return', 'comment'), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await queryInterface.addIndex('study_reviews', ['study_id', 'created_at']);
};

export const down: MigrationModule['down'] = async ({ context: queryInterface }) => {
  for (const table of ['study_reviews', 'study_fits', 'study_points', 'study_uploads', 'studies']) {
    await queryInterface.dropTable(table);
  }
  await queryInterface.sequelize.query(
    'DROP TYPE IF EXISTS enum_study_reviews_action; DROP TYPE IF EXISTS enum_study_uploads_parse_status; ' +
      'DROP TYPE IF EXISTS enum_studies_status;',
  );
};
