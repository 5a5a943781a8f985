import pg from 'pg';

// int8 (counts) fits in a JS number for every count we make; numeric columns hold measured
// quantities (charges, elevations), where a double is exact enough and far easier to use.
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number.parseInt(v, 10));
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number.parseFloat(v));

export { pg };

// A calendar date (install date, manufacture date) stays the 'YYYY-MM-DD' text it is; turning it
// into a JS Date would shift it by the server's time zone.
pg.types.setTypeParser(pg.types.builtins.DATE, (v) => v);
