-- The run store of swaygate, SQLite dialect.
-- Times are UTC text of fixed width (2006-01-02T15:04:05.000000000Z), so that
-- they sort as text.

CREATE TABLE runs (
    seq            INTEGER PRIMARY KEY AUTOINCREMENT, -- storage order: newest first = highest
    id             TEXT    NOT NULL UNIQUE,
    project        TEXT    NOT NULL,
    status         TEXT    NOT NULL,
    created_at     TEXT    NOT NULL,
    tool_version   TEXT    NOT NULL DEFAULT '',
    standard       TEXT    NOT NULL,
    sway_method    TEXT    NOT NULL,
    scope          TEXT    NOT NULL,
    model_name     TEXT    NOT NULL,
    model_sha256   TEXT    NOT NULL,
    model_schema   TEXT    NOT NULL DEFAULT '',
    model_size     INTEGER NOT NULL,
    members        INTEGER NOT NULL,
    pass           INTEGER NOT NULL,
    fail           INTEGER NOT NULL,
    needs_analysis INTEGER NOT NULL,
    warnings       INTEGER NOT NULL DEFAULT 0,
    gate_policy    TEXT    NOT NULL,
    gate_passed    INTEGER NOT NULL,
    duration_ms    INTEGER NOT NULL DEFAULT 0
);

CREATE INDEX runs_project_seq ON runs (project, seq);
CREATE INDEX runs_created_at ON runs (created_at);

-- One row per checked element: what member history, run-to-run differences
-- and sign-offs are built on.
CREATE TABLE elements (
    run_id                TEXT NOT NULL REFERENCES runs (id) ON DELETE CASCADE,
    global_id             TEXT NOT NULL,
    name                  TEXT NOT NULL DEFAULT '',
    storey                TEXT NOT NULL DEFAULT '',
    entity                TEXT NOT NULL DEFAULT '',
    verdict               TEXT NOT NULL,
    governing_combination TEXT NOT NULL DEFAULT '',
    governing_delta_m     REAL,            -- NULL when unknown
    reasons               TEXT NOT NULL DEFAULT '', -- reason codes joined by ','
    PRIMARY KEY (run_id, global_id)
) WITHOUT ROWID;

CREATE INDEX elements_global_id ON elements (global_id, run_id);

-- The documents of a run, gzip-compressed.
CREATE TABLE documents (
    run_id   TEXT    NOT NULL REFERENCES runs (id) ON DELETE CASCADE,
    kind     TEXT    NOT NULL,
    encoding TEXT    NOT NULL,
    size     INTEGER NOT NULL, -- bytes decompressed
    body     BLOB    NOT NULL,
    PRIMARY KEY (run_id, kind)
) WITHOUT ROWID;
