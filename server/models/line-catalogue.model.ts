import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize'
import type { CatalogueProvenance } from '../../shared/schemas/catalogues'
import type { User } from './user.model'

/**
 * An imported line catalogue: what it is and where it came from. Its lines live in
 * catalogue_line_blocks (binary blocks, see server/catalogue/line-block-codec.ts).
 */
export class LineCatalogue extends Model<
  InferAttributes<LineCatalogue>,
  InferCreationAttributes<LineCatalogue>
> {
  declare id: CreationOptional<number>
  declare name: string
  declare description: string
  declare kind: 'imported'
  declare sourceFileName: string
  declare provenance: CatalogueProvenance
  /** Runs use the built-in lines of every molecule this import lacks, plus all imported lines. */
  declare mergeWithBuiltIn: boolean
  declare lineCount: number
  declare blockCount: number
  declare minWavenumberCm: number
  declare maxWavenumberCm: number
  /** 'sha256:<hex>' of the stored block data, in block order. */
  declare checksum: string
  declare ownerId: ForeignKey<User['id']>
  declare owner?: NonAttribute<User>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>

  static initModel(sequelize: Sequelize): typeof LineCatalogue {
    LineCatalogue.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        kind: { type: DataTypes.STRING(16), allowNull: false },
        sourceFileName: { type: DataTypes.STRING(255), allowNull: false },
        provenance: { type: DataTypes.JSONB, allowNull: false },
        mergeWithBuiltIn: {
          type: DataTypes.BOOLEAN,
          allowNull: false,
          field: 'merge_with_builtin',
        },
        lineCount: { type: DataTypes.INTEGER, allowNull: false },
        blockCount: { type: DataTypes.INTEGER, allowNull: false },
        minWavenumberCm: { type: DataTypes.DOUBLE, allowNull: false },
        maxWavenumberCm: { type: DataTypes.DOUBLE, allowNull: false },
        checksum: { type: DataTypes.STRING(80), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'line_catalogues', modelName: 'LineCatalogue' },
    )
    return LineCatalogue
  }
}

/** One block of up to 50 000 lines of an imported catalogue. */
export class CatalogueLineBlock extends Model<
  InferAttributes<CatalogueLineBlock>,
  InferCreationAttributes<CatalogueLineBlock>
> {
  declare catalogueId: ForeignKey<LineCatalogue['id']>
  declare blockIndex: number
  declare lineCount: number
  declare minWavenumberCm: number
  declare maxWavenumberCm: number
  declare data: Buffer

  static initModel(sequelize: Sequelize): typeof CatalogueLineBlock {
    CatalogueLineBlock.init(
      {
        catalogueId: { type: DataTypes.INTEGER, primaryKey: true },
        blockIndex: { type: DataTypes.INTEGER, primaryKey: true },
        lineCount: { type: DataTypes.INTEGER, allowNull: false },
        minWavenumberCm: { type: DataTypes.DOUBLE, allowNull: false },
        maxWavenumberCm: { type: DataTypes.DOUBLE, allowNull: false },
        data: { type: DataTypes.BLOB, allowNull: false },
      },
      {
        sequelize,
        tableName: 'catalogue_line_blocks',
        modelName: 'CatalogueLineBlock',
        timestamps: false,
      },
    )
    return CatalogueLineBlock
  }
}

/** Initialises both catalogue models and wires the owner association (after User exists). */
export function initLineCatalogueModels(sequelize: Sequelize, user: typeof User): void {
  LineCatalogue.initModel(sequelize)
  CatalogueLineBlock.initModel(sequelize)
  LineCatalogue.belongsTo(user, { as: 'owner', foreignKey: 'ownerId' })
}
