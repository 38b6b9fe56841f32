import { Button } from '../../../components/button';
import { param, type ParamField } from '../lib/model-form-state';
import { ParamRow } from './param-row';

/**
 * An ordered list of fittable values (frequency or DM derivatives): one row per entry with its solve
 * switch, "add" at the end and "remove last" (removing from the middle would renumber the paths of
 * every later entry, and with them the meaning of their solve switches).
 */
export function ValueList({
  itemLabel,
  unitOf,
  items,
  onChange,
  errors,
  errorPrefix,
  addLabel,
}: {
  itemLabel: (index: number) => string;
  unitOf: (index: number) => string;
  items: ParamField[];
  onChange: (items: ParamField[]) => void;
  errors: Record<string, string>;
  errorPrefix: string;
  addLabel: string;
}) {
  return (
    <div className="flex flex-col gap-3">
      {items.map((item, index) => (
        <ParamRow
          key={index}
          label={itemLabel(index)}
          unit={unitOf(index)}
          field={item}
          error={errors[`${errorPrefix}.${index}`]}
          onChange={(next) => onChange(items.map((old, i) => (i === index ? next : old)))}
        />
      ))}
      <div className="flex gap-2">
        <Button variant="secondary" size="sm" onClick={() => onChange([...items, param('0')])}>
          {addLabel}
        </Button>
        {items.length > 0 ? (
          <Button variant="ghost" size="sm" onClick={() => onChange(items.slice(0, -1))}>
            Remove the last one
          </Button>
        ) : null}
      </div>
    </div>
  );
}
