import { DataTypes } from 'sequelize'
import type { Migration } from '../migrator'

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('reviews', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'runs', key: 'id' },
      onDelete: 'CASCADE',
    },
    reviewer_id: {
      type: DataTypes.INTEGER,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'RESTRICT',
    },
    state: { type: DataTypes.STRING(24), allowNull: false },
    comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    signature: { type: DataTypes.STRING(64), allowNull: false },
    results_digest: { type: DataTypes.STRING(64), allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  })
  await qi.addIndex('reviews', ['run_id', 'created_at'])
  await qi.addConstraint('reviews', {
    type: 'check',
    name: 'reviews_state_check',
    fields: ['state'],
    where: { state: ['signed-off', 'changes-requested'] },
  })
  // At most one sign-off per run, whatever the application does.
  await qi.addIndex('reviews', ['run_id'], {
    name: 'reviews_one_sign_off_per_run',
    unique: true,
    where: { state: 'signed-off' },
  })
  // Signed runs are frozen: the database itself refuses to delete them (reviews of unsigned runs
  // go with their run through ON DELETE CASCADE).
  await qi.sequelize.query(`
    CREATE FUNCTION refuse_signed_run_delete() RETURNS trigger AS $$
    BEGIN
      IF EXISTS (SELECT 1 FROM reviews WHERE run_id = OLD.id AND state = 'signed-off') THEN
        RAISE EXCEPTION 'run % is signed off and cannot be deleted', OLD.id USING ERRCODE = 'restrict_violation';
      END IF;
      RETURN OLD;
    END
    $$ LANGUAGE plpgsql`)
  await qi.sequelize.query(`
    CREATE TRIGGER runs_refuse_signed_delete BEFORE DELETE ON runs
    FOR EACH ROW EXECUTE FUNCTION refuse_signed_run_delete()`)
}

export const down: Migration = async ({ context: qi }) => {
  await qi.sequelize.query('DROP TRIGGER IF EXISTS runs_refuse_signed_delete ON runs')
  await qi.sequelize.query('DROP FUNCTION IF EXISTS refuse_signed_run_delete()')
  await qi.dropTable('reviews')
}
