-- Before wind had its own unit, imperial users saw wind in mph: keep showing them mph.
UPDATE "users" SET "wind_units" = 'mph' WHERE "units" = 'imperial';
