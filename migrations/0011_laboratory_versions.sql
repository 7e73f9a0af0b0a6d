CREATE TABLE "laboratory_versions" (
	"laboratory_id" integer PRIMARY KEY NOT NULL,
	"version" bigint DEFAULT 1 NOT NULL
);
