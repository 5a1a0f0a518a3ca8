/**
 * A writer of NetCDF classic format files (CDF-1), written from the published specification: Unidata,
 * "The NetCDF Classic Format Specification" (NetCDF Users Guide, File Format Specifications; the BNF
 * grammar of `netcdf_file = header data`). No npm package writes NetCDF; netcdfjs reads it back in the tests.
 *
 * Only what the station series need: fixed-size dimensions (no record dimension, so numrecs is 0), the six
 * classic types, global and variable attributes, scalar and array variables. Everything is big-endian.
 */

/** The classic external types and their nc_type codes (spec: NC_BYTE = 1 … NC_DOUBLE = 6). */
export const NC_TYPES = { byte: 1, char: 2, short: 3, int: 4, float: 5, double: 6 } as const;
export type NcType = keyof typeof NC_TYPES;

const TYPE_SIZE: Record<NcType, number> = { byte: 1, char: 1, short: 2, int: 4, float: 4, double: 8 };

// Tags of the header lists (spec: NC_DIMENSION = \x00\x00\x00\x0A, NC_VARIABLE = …\x0B, NC_ATTRIBUTE = …\x0C).
const NC_DIMENSION = 0x0a;
const NC_VARIABLE = 0x0b;
const NC_ATTRIBUTE = 0x0c;
/** The largest begin offset CDF-1 can hold (a signed 32-bit OFFSET). */
const MAX_CDF1_OFFSET = 2 ** 31 - 1;

export interface NcAttribute {
  name: string;
  type: NcType;
  /** Text for `char`; numbers for the other types. */
  value: string | readonly number[];
}

export interface NcDimension {
  name: string;
  length: number;
}

export interface NcVariable {
  name: string;
  type: NcType;
  /** Dimension names, outermost first; none for a scalar. */
  dimensions: readonly string[];
  attributes: readonly NcAttribute[];
  /** Text for `char` (padded with NUL to the variable's size), numbers otherwise; row-major. */
  data: string | ArrayLike<number>;
}

export interface NcFile {
  dimensions: readonly NcDimension[];
  attributes: readonly NcAttribute[];
  variables: readonly NcVariable[];
}

/** Big-endian byte sink that grows as needed. */
class ByteWriter {
  private bytes = new Uint8Array(1024);
  private view = new DataView(this.bytes.buffer);
  length = 0;

  private reserve(count: number): void {
    if (this.length + count <= this.bytes.length) return;
    let size = this.bytes.length * 2;
    while (size < this.length + count) size *= 2;
    const grown = new Uint8Array(size);
    grown.set(this.bytes.subarray(0, this.length));
    this.bytes = grown;
    this.view = new DataView(grown.buffer);
  }

  int32(value: number): void {
    this.reserve(4);
    this.view.setInt32(this.length, value, false);
    this.length += 4;
  }

  raw(bytes: Uint8Array): void {
    this.reserve(bytes.length);
    this.bytes.set(bytes, this.length);
    this.length += bytes.length;
  }

  /** Zero bytes up to the next multiple of 4 (spec: header padding is NUL bytes). */
  pad(): void {
    const extra = (4 - (this.length % 4)) % 4;
    this.raw(new Uint8Array(extra));
  }

  values(type: NcType, values: ArrayLike<number>): void {
    const size = TYPE_SIZE[type];
    this.reserve(values.length * size);
    for (let i = 0; i < values.length; i++) {
      const at = this.length + i * size;
      const value = values[i];
      if (type === 'byte') this.view.setInt8(at, value);
      else if (type === 'short') this.view.setInt16(at, value, false);
      else if (type === 'int') this.view.setInt32(at, value, false);
      else if (type === 'float') this.view.setFloat32(at, value, false);
      else if (type === 'double') this.view.setFloat64(at, value, false);
      else this.view.setUint8(at, value);
    }
    this.length += values.length * size;
  }

  result(): Uint8Array {
    return this.bytes.slice(0, this.length);
  }
}

const utf8 = new TextEncoder();

/** name = nelems namestring, padded (spec: names are UTF-8, NFC-normalized). */
function writeName(out: ByteWriter, name: string): void {
  if (!/^[A-Za-z_][A-Za-z0-9_.@+-]*$/.test(name)) throw new Error(`"${name}" is not a NetCDF name`);
  const bytes = utf8.encode(name.normalize('NFC'));
  out.int32(bytes.length);
  out.raw(bytes);
  out.pad();
}

function writeAttributes(out: ByteWriter, attributes: readonly NcAttribute[]): void {
  if (attributes.length === 0) {
    // ABSENT = ZERO ZERO.
    out.int32(0);
    out.int32(0);
    return;
  }
  out.int32(NC_ATTRIBUTE);
  out.int32(attributes.length);
  for (const attribute of attributes) {
    writeName(out, attribute.name);
    out.int32(NC_TYPES[attribute.type]);
    if (attribute.type === 'char') {
      if (typeof attribute.value !== 'string') throw new Error(`attribute ${attribute.name} of type char needs text`);
      const bytes = utf8.encode(attribute.value);
      out.int32(bytes.length);
      out.raw(bytes);
    } else {
      if (typeof attribute.value === 'string') throw new Error(`attribute ${attribute.name} of type ${attribute.type} needs numbers`);
      out.int32(attribute.value.length);
      out.values(attribute.type, attribute.value);
    }
    out.pad();
  }
}

function elementCount(variable: NcVariable, lengths: ReadonlyMap<string, number>): number {
  return variable.dimensions.reduce((product, name) => {
    const length = lengths.get(name);
    if (length === undefined) throw new Error(`variable ${variable.name} names an unknown dimension ${name}`);
    return product * length;
  }, 1);
}

/** vsize: the variable's bytes rounded up to a multiple of 4 (spec: "vsize = … rounded up to the next multiple of 4"). */
function paddedSize(variable: NcVariable, lengths: ReadonlyMap<string, number>): number {
  const bytes = elementCount(variable, lengths) * TYPE_SIZE[variable.type];
  return Math.ceil(bytes / 4) * 4;
}

function writeHeader(out: ByteWriter, file: NcFile, begins: readonly number[]): void {
  const lengths = new Map(file.dimensions.map((dimension) => [dimension.name, dimension.length]));
  const dimensionIds = new Map(file.dimensions.map((dimension, index) => [dimension.name, index]));
  // magic = 'C' 'D' 'F' VERSION_BYTE (\x01: classic format).
  out.raw(new Uint8Array([0x43, 0x44, 0x46, 0x01]));
  // numrecs: no record dimension.
  out.int32(0);
  if (file.dimensions.length === 0) {
    out.int32(0);
    out.int32(0);
  } else {
    out.int32(NC_DIMENSION);
    out.int32(file.dimensions.length);
    for (const dimension of file.dimensions) {
      // A length of 0 would declare the record dimension; this writer keeps every dimension fixed.
      if (!Number.isInteger(dimension.length) || dimension.length < 1) throw new Error(`dimension ${dimension.name} needs a length of at least 1`);
      writeName(out, dimension.name);
      out.int32(dimension.length);
    }
  }
  writeAttributes(out, file.attributes);
  if (file.variables.length === 0) {
    out.int32(0);
    out.int32(0);
    return;
  }
  out.int32(NC_VARIABLE);
  out.int32(file.variables.length);
  file.variables.forEach((variable, index) => {
    writeName(out, variable.name);
    out.int32(variable.dimensions.length);
    for (const name of variable.dimensions) out.int32(dimensionIds.get(name) as number);
    writeAttributes(out, variable.attributes);
    out.int32(NC_TYPES[variable.type]);
    out.int32(paddedSize(variable, lengths));
    // begin = OFFSET, 32 bits in CDF-1.
    out.int32(begins[index]);
  });
}

/** The bytes of a NetCDF classic file. Throws when a name, a dimension or a data length is wrong. */
export function writeNetcdfClassic(file: NcFile): Uint8Array {
  const lengths = new Map(file.dimensions.map((dimension) => [dimension.name, dimension.length]));
  // The header's length does not depend on the begin offsets (each is 4 bytes), so measure it with zeros first.
  const probe = new ByteWriter();
  writeHeader(probe, file, file.variables.map(() => 0));
  const begins: number[] = [];
  let offset = probe.length;
  for (const variable of file.variables) {
    begins.push(offset);
    offset += paddedSize(variable, lengths);
  }
  if (offset > MAX_CDF1_OFFSET) throw new Error('the data are too large for the NetCDF classic format (2 GiB)');

  const out = new ByteWriter();
  writeHeader(out, file, begins);
  for (const variable of file.variables) {
    const count = elementCount(variable, lengths);
    if (variable.type === 'char') {
      if (typeof variable.data !== 'string') throw new Error(`variable ${variable.name} of type char needs text`);
      const bytes = utf8.encode(variable.data);
      if (bytes.length > count) throw new Error(`variable ${variable.name} holds at most ${count} bytes`);
      const padded = new Uint8Array(count);
      padded.set(bytes);
      out.raw(padded);
    } else {
      if (typeof variable.data === 'string') throw new Error(`variable ${variable.name} of type ${variable.type} needs numbers`);
      if (variable.data.length !== count) throw new Error(`variable ${variable.name} needs ${count} values, not ${variable.data.length}`);
      out.values(variable.type, variable.data);
    }
    out.pad();
  }
  return out.result();
}
