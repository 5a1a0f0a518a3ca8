/**
 * Checks a value against the subset of JSON Schema (2020-12, as OpenAPI 3.1 uses it) that the generated
 * description holds: type (with "null" in a type list), enum, properties, required, items, $ref into
 * components, anyOf / oneOf, minimum / maximum. Returns the problems found, each with its path.
 */
type Schema = Record<string, unknown>;

export function checkAgainstSchema(value: unknown, schema: Schema, components: Record<string, Schema>, path = '$'): string[] {
  if (typeof schema['$ref'] === 'string') {
    const name = (schema['$ref'] as string).replace('#/components/schemas/', '');
    const target = components[name];
    return target ? checkAgainstSchema(value, target, components, path) : [`${path}: unknown $ref ${name}`];
  }
  const alternatives = (schema['anyOf'] ?? schema['oneOf']) as Schema[] | undefined;
  if (alternatives) {
    const fits = alternatives.filter((alternative) => checkAgainstSchema(value, alternative, components, path).length === 0);
    return fits.length > 0 ? [] : [`${path}: fits none of the ${alternatives.length} alternatives`];
  }
  const problems: string[] = [];
  const types = schema['type'] === undefined ? null : ([] as string[]).concat(schema['type'] as string | string[]);
  const actual = value === null ? 'null' : Array.isArray(value) ? 'array' : Number.isInteger(value) ? 'integer' : typeof value;
  if (types && !types.includes(actual) && !(actual === 'integer' && types.includes('number'))) return [`${path}: is ${actual}, not ${types.join(' or ')}`];
  if (Array.isArray(schema['enum']) && !(schema['enum'] as unknown[]).includes(value)) problems.push(`${path}: ${JSON.stringify(value)} is not one of the enum`);
  if (typeof value === 'number') {
    if (typeof schema['minimum'] === 'number' && value < (schema['minimum'] as number)) problems.push(`${path}: below minimum`);
    if (typeof schema['maximum'] === 'number' && value > (schema['maximum'] as number)) problems.push(`${path}: above maximum`);
  }
  if (actual === 'object' && value !== null) {
    const object = value as Record<string, unknown>;
    for (const key of (schema['required'] as string[] | undefined) ?? []) if (!(key in object)) problems.push(`${path}.${key}: required but missing`);
    const properties = (schema['properties'] as Record<string, Schema> | undefined) ?? {};
    for (const [key, propertySchema] of Object.entries(properties)) {
      if (key in object) problems.push(...checkAgainstSchema(object[key], propertySchema, components, `${path}.${key}`));
    }
    if (schema['additionalProperties'] === false) {
      for (const key of Object.keys(object)) if (!(key in properties)) problems.push(`${path}.${key}: not in the description`);
    }
  }
  if (Array.isArray(value) && schema['items']) {
    value.forEach((item, index) => problems.push(...checkAgainstSchema(item, schema['items'] as Schema, components, `${path}[${index}]`)));
  }
  return problems;
}
