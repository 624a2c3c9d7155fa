import type { Model, ModelStatic } from 'sequelize';

/**
 * A select list of every attribute of a model, each column named by its attribute (`"on_shelf_at" AS
 * "onShelfAt"`), so a row read by a plain statement builds the model instance exactly as a Sequelize
 * finder would. `alias` qualifies the columns; `prefix` goes before each attribute name, to tell the
 * columns of two tables apart in one row.
 */
export function modelColumns(model: ModelStatic<Model>, options: { alias?: string; prefix?: string } = {}): string {
  const qualifier = options.alias === undefined ? '' : `${options.alias}.`;
  return Object.entries(model.getAttributes())
    .map(([name, attribute]) => `${qualifier}"${attribute.field ?? name}" AS "${options.prefix ?? ''}${name}"`)
    .join(', ');
}
