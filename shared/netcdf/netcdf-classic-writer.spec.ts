import { NetCDFReader } from 'netcdfjs';
import { writeNetcdfClassic } from './netcdf-classic-writer';

// Layout per Unidata, "The NetCDF Classic Format Specification": magic 'CDF' 0x01, numrecs, then the
// dimension list tagged NC_DIMENSION (0x0A), names as length + bytes padded to 4, big-endian integers.
describe('writeNetcdfClassic', () => {
  const file = writeNetcdfClassic({
    dimensions: [{ name: 'time', length: 3 }],
    attributes: [{ name: 'title', type: 'char', value: 'abc' }],
    variables: [
      { name: 'x', type: 'short', dimensions: ['time'], attributes: [{ name: 'scale', type: 'float', value: [0.5] }], data: [1, -2, 3] },
      { name: 'y', type: 'double', dimensions: [], attributes: [], data: [2.5] },
    ],
  });

  it('when a file is written, then it starts with the classic magic, no records and the dimension list', () => {
    const view = new DataView(file.buffer, file.byteOffset, file.byteLength);
    expect([...file.subarray(0, 4)]).toEqual([0x43, 0x44, 0x46, 0x01]);
    expect(view.getInt32(4)).toBe(0);
    expect(view.getInt32(8)).toBe(0x0a);
    expect(view.getInt32(12)).toBe(1);
    // name "time": length 4, then the 4 bytes (no padding needed), then the length 3.
    expect(view.getInt32(16)).toBe(4);
    expect(new TextDecoder().decode(file.subarray(20, 24))).toBe('time');
    expect(view.getInt32(24)).toBe(3);
    expect(file.byteLength % 4).toBe(0);
  });

  it('when netcdfjs reads it back, then the values and attributes are the ones written', () => {
    const reader = new NetCDFReader(file);

    expect(reader.getAttribute('title')).toBe('abc');
    // netcdfjs reads the padded vsize: 3 shorts padded to 8 bytes read as four values.
    expect((reader.getDataVariable('x') as number[]).slice(0, 3)).toEqual([1, -2, 3]);
    expect(reader.getDataVariable('y')).toEqual([2.5]);
  });

  it('when the data do not fit the dimensions or a name is not a NetCDF name, then it refuses to write', () => {
    expect(() => writeNetcdfClassic({ dimensions: [{ name: 'time', length: 2 }], attributes: [], variables: [{ name: 'x', type: 'int', dimensions: ['time'], attributes: [], data: [1] }] })).toThrow('needs 2 values');
    expect(() => writeNetcdfClassic({ dimensions: [{ name: '9bad', length: 1 }], attributes: [], variables: [] })).toThrow('not a NetCDF name');
    expect(() => writeNetcdfClassic({ dimensions: [{ name: 'time', length: 0 }], attributes: [], variables: [] })).toThrow('at least 1');
  });
});
