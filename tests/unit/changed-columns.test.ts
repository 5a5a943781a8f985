import { describe, expect, it } from 'vitest';
import { changedColumns } from '@/lib/changed-columns';

describe('changedColumns', () => {
  it('leaves out the fields a partial update did not name, keeps null (a cleared field) and false', () => {
    expect(changedColumns({ name: 'Cold room 2', notes: null, area_id: undefined, receives_reports: false })).toEqual({
      name: 'Cold room 2',
      notes: null,
      receives_reports: false,
    });
  });

  it('writes nothing when nothing was named', () => {
    expect(changedColumns({ name: undefined, city: undefined })).toEqual({});
  });
});
