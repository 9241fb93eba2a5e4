#include "planner/campaign_log.h"

#include <cmath>
#include <cstdio>
#include <filesystem>

#include "io/input_file.h"
#include "io/met_csv_reader.h"
#include "io/sqlite_db.h"
#include "planner/error.h"

namespace fs = std::filesystem;

namespace planner {
namespace {

const char kFormatName[] = "fillcast campaign log";

const char kSchema[] = R"sql(
CREATE TABLE meta (
  key   TEXT PRIMARY KEY,
  value TEXT NOT NULL
);
CREATE TABLE ingests (
  id             INTEGER PRIMARY KEY,
  file           TEXT NOT NULL,
  ingested_at    TEXT NOT NULL,
  rows           INTEGER NOT NULL,
  added          INTEGER NOT NULL,
  already_logged INTEGER NOT NULL,
  conflicting    INTEGER NOT NULL
);
CREATE TABLE records (
  time_s        INTEGER PRIMARY KEY,
  speed_ms      REAL,
  speed_std_ms  REAL,
  direction_deg REAL,
  state         TEXT NOT NULL
                CHECK (state IN ('production', 'parked', 'reduced', 'outage')),
  quality_ok    INTEGER NOT NULL CHECK (quality_ok IN (0, 1)),
  event         TEXT,
  ingest_id     INTEGER NOT NULL REFERENCES ingests (id),
  source_line   INTEGER NOT NULL,
  channels_down TEXT
);
CREATE TABLE progress_runs (
  id               INTEGER PRIMARY KEY,
  as_of            TEXT NOT NULL,
  made_at          TEXT NOT NULL,
  inputs_digest    TEXT NOT NULL,
  records_used     INTEGER NOT NULL,
  runs             INTEGER NOT NULL,
  seed             TEXT NOT NULL,
  complete         INTEGER NOT NULL,
  p_by_planned_end REAL NOT NULL,
  planned_end      TEXT NOT NULL,
  p50_weeks REAL, p80_weeks REAL, p90_weeks REAL,
  p50_date TEXT, p80_date TEXT, p90_date TEXT,
  result_json      TEXT NOT NULL,
  UNIQUE (as_of, inputs_digest)
);
)sql";

bool SameNumber(double a, double b) { return (std::isnan(a) && std::isnan(b)) || a == b; }

std::string NumberText(double x) {
  if (std::isnan(x)) return "empty";
  char buf[40];
  std::snprintf(buf, sizeof buf, "%g", x);
  return buf;
}

// "speed_ms 7.4 logged, 7.9 here; state parked logged, production here".
std::string Difference(const LoggedRecord& logged, const LoggedRecord& here) {
  std::string out;
  auto add = [&out](const char* field, const std::string& a, const std::string& b) {
    out += (out.empty() ? "" : "; ") + std::string(field) + " " + a + " logged, " + b +
           " here";
  };
  if (!SameNumber(logged.speed_ms, here.speed_ms))
    add("speed_ms", NumberText(logged.speed_ms), NumberText(here.speed_ms));
  if (!SameNumber(logged.speed_std_ms, here.speed_std_ms))
    add("speed_std_ms", NumberText(logged.speed_std_ms), NumberText(here.speed_std_ms));
  if (!SameNumber(logged.direction_deg, here.direction_deg))
    add("direction_deg", NumberText(logged.direction_deg),
        NumberText(here.direction_deg));
  if (logged.state != here.state)
    add("state", LoggedStateName(logged.state), LoggedStateName(here.state));
  if (logged.quality_ok != here.quality_ok)
    add("quality", logged.quality_ok ? "ok" : "rejected",
        here.quality_ok ? "ok" : "rejected");
  if (logged.event != here.event)
    add("event", logged.event.empty() ? "none" : logged.event,
        here.event.empty() ? "none" : here.event);
  if (logged.channels_down != here.channels_down)
    add("channels_down", logged.channels_down.empty() ? "none" : logged.channels_down,
        here.channels_down.empty() ? "none" : here.channels_down);
  return out;
}

LoggedRecord ReadRecord(const SqliteStatement& s, int first_column) {
  LoggedRecord r;
  r.time_s = s.Int(first_column);
  r.speed_ms = s.Real(first_column + 1);
  r.speed_std_ms = s.Real(first_column + 2);
  r.direction_deg = s.Real(first_column + 3);
  r.state = ParseLoggedState(s.Text(first_column + 4)).value_or(LoggedState::kParked);
  r.quality_ok = s.Int(first_column + 5) != 0;
  r.event = s.Text(first_column + 6);
  r.channels_down = s.Text(first_column + 7);
  return r;
}

const char kRecordColumns[] =
    "time_s, speed_ms, speed_std_ms, direction_deg, state, quality_ok, event, "
    "channels_down";

}  // namespace

std::string CampaignLog::DefaultPath(const std::string& plan_path) {
  const fs::path plan(plan_path);
  return (plan.parent_path() / (plan.stem().string() + ".campaign.sqlite")).string();
}

CampaignLog::CampaignLog(const std::string& path, bool create,
                         const std::string& plan_name)
    : path_(path) {
  std::error_code ec;
  const bool exists = fs::exists(path, ec);
  if (!exists && !create) {
    throw InputError(path +
                     ": no campaign log here; add logged records first with "
                     "'fillcast log add PLAN RECORDS.csv' (or name the log with --log)");
  }
  if (fs::is_directory(path, ec)) {
    throw InputError(path + ": is a folder; expected a campaign log file");
  }
  if (exists) io::CheckInputFile(path, "campaign log");
  db_ = std::make_unique<SqliteDb>(path, create);
  CheckOrCreateSchema(create, plan_name);
}

CampaignLog::~CampaignLog() = default;
CampaignLog::CampaignLog(CampaignLog&&) noexcept = default;

void CampaignLog::CheckOrCreateSchema(bool create, const std::string& plan_name) {
  // Under the write lock: of two fillcast processes creating the same log at
  // once, the second waits here and then finds the first one's schema.
  std::unique_ptr<SqliteTransaction> t;
  bool empty = false;
  if (create) {
    try {
      t = std::make_unique<SqliteTransaction>(*db_);
      SqliteStatement count(*db_, "SELECT COUNT(*) FROM sqlite_master");
      empty = count.Step() && count.Int(0) == 0;
    } catch (const InputError&) {
      empty = false;  // not an SQLite file: reported below
      t.reset();
    }
  }
  if (empty) {
    db_->Exec(kSchema);
    SqliteStatement put(*db_, "INSERT INTO meta (key, value) VALUES (?, ?)");
    const std::pair<std::string, std::string> rows[] = {
        {"format", kFormatName},
        {"schema_version", std::to_string(kCampaignLogSchemaVersion)},
        {"created_by", std::string("fillcast ") + FILLCAST_VERSION},
        {"plan_name", plan_name}};
    for (const auto& [key, value] : rows) {
      put.Reset();
      put.Bind(1, key).Bind(2, value).Step();
    }
    t->Commit();
    return;
  }
  t.reset();
  std::string format, version;
  try {
    SqliteStatement get(*db_, "SELECT key, value FROM meta");
    while (get.Step()) {
      if (get.Text(0) == "format") format = get.Text(1);
      if (get.Text(0) == "schema_version") version = get.Text(1);
    }
  } catch (const InputError&) {
    format.clear();  // no meta table, or not an SQLite file at all
  }
  if (format != kFormatName) {
    throw InputError(path_ +
                     ": is not a fillcast campaign log (expected an SQLite file with "
                     "a meta table naming the format); choose another file with --log");
  }
  if (version == "1") version = MigrateFromVersion1();
  if (version != std::to_string(kCampaignLogSchemaVersion)) {
    throw InputError(path_ + ": campaign log schema version '" + version +
                     "' is not one this fillcast reads (version " +
                     std::to_string(kCampaignLogSchemaVersion) +
                     "); use the fillcast that wrote it");
  }
}

// Version 1 had no records.channels_down: add it (empty: every group was
// recording), under the write lock, where another process may have done it
// first. Returns the version after.
std::string CampaignLog::MigrateFromVersion1() {
  SqliteTransaction t(*db_);
  SqliteStatement get(*db_, "SELECT value FROM meta WHERE key = 'schema_version'");
  const std::string version = get.Step() ? get.Text(0) : "";
  if (version != "1") return version;
  db_->Exec(
      "ALTER TABLE records ADD COLUMN channels_down TEXT;"
      "UPDATE meta SET value = '2' WHERE key = 'schema_version';");
  t.Commit();
  return "2";
}

IngestReport CampaignLog::Ingest(const std::string& file,
                                 const std::vector<LoggedRow>& rows,
                                 const IngestOptions& options) {
  SqliteTransaction t(*db_);
  IngestReport report = IngestRows(file, rows, options);
  t.Commit();
  return report;
}

std::vector<IngestReport> CampaignLog::IngestAll(const std::vector<IngestInput>& files,
                                                 const IngestOptions& options) {
  SqliteTransaction t(*db_);
  std::vector<IngestReport> reports;
  for (const IngestInput& f : files)
    reports.push_back(IngestRows(f.file, *f.rows, options));
  t.Commit();
  return reports;
}

IngestReport CampaignLog::IngestRows(const std::string& file,
                                     const std::vector<LoggedRow>& rows,
                                     const IngestOptions& options) {
  IngestReport report;
  report.file = file;
  report.rows = static_cast<int64_t>(rows.size());
  // The file's ingest row is written with its first new record: a file that
  // adds nothing leaves the log exactly as it was.
  int64_t ingest_id = -1;
  auto ingest = [&] {
    if (ingest_id >= 0) return ingest_id;
    SqliteStatement add(*db_,
                        "INSERT INTO ingests (file, ingested_at, rows, added, "
                        "already_logged, conflicting) VALUES (?, ?, 0, 0, 0, 0)");
    add.Bind(1, file).Bind(2, options.now_utc).Step();
    return ingest_id = db_->LastInsertId();
  };
  SqliteStatement find(*db_, std::string("SELECT ") + kRecordColumns +
                                 ", ingests.file, records.source_line FROM records "
                                 "JOIN ingests ON ingests.id = records.ingest_id "
                                 "WHERE time_s = ?");
  SqliteStatement insert(*db_, std::string("INSERT INTO records (") + kRecordColumns +
                                   ", ingest_id, source_line) VALUES "
                                   "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?)");
  int64_t done = 0;
  for (const LoggedRow& row : rows) {
    const LoggedRecord& r = row.record;
    find.Reset();
    find.Bind(1, r.time_s);
    if (find.Step()) {
      const LoggedRecord logged = ReadRecord(find, 0);
      const std::string difference = Difference(logged, r);
      if (difference.empty()) {
        ++report.already_logged;
      } else {
        ++report.conflicting;
        if (report.conflicts.size() < kMaxListedConflicts) {
          report.conflicts.push_back(IngestConflict{
              file + ":" + std::to_string(row.line), r.time_s,
              find.Text(8) + ":" + std::to_string(find.Int(9)), difference});
        }
      }
    } else {
      insert.Reset();
      insert.Bind(1, r.time_s)
          .BindOrNull(2, r.speed_ms)
          .BindOrNull(3, r.speed_std_ms)
          .BindOrNull(4, r.direction_deg)
          .Bind(5, std::string(LoggedStateName(r.state)))
          .Bind(6, static_cast<int64_t>(r.quality_ok ? 1 : 0))
          .BindOrNull(
              7, r.event.empty() ? std::nullopt : std::optional<std::string>(r.event))
          .BindOrNull(8, r.channels_down.empty()
                             ? std::nullopt
                             : std::optional<std::string>(r.channels_down))
          .Bind(9, ingest())
          .Bind(10, row.line)
          .Step();
      ++report.added;
    }
    ++done;
    if (options.after_row) options.after_row(done);
  }
  if (report.added == 0) {  // nothing new: nothing written
    report.records_in_log = RecordCount();
    return report;
  }
  SqliteStatement update(*db_,
                         "UPDATE ingests SET rows = ?, added = ?, already_logged = ?, "
                         "conflicting = ? WHERE id = ?");
  update.Bind(1, report.rows)
      .Bind(2, report.added)
      .Bind(3, report.already_logged)
      .Bind(4, report.conflicting)
      .Bind(5, ingest_id)
      .Step();
  report.records_in_log = RecordCount();
  return report;
}

std::vector<LoggedRecord> CampaignLog::Records() const {
  std::vector<LoggedRecord> out;
  SqliteStatement s(
      *db_, std::string("SELECT ") + kRecordColumns + " FROM records ORDER BY time_s");
  while (s.Step()) out.push_back(ReadRecord(s, 0));
  return out;
}

int64_t CampaignLog::RecordCount() const {
  SqliteStatement s(*db_, "SELECT COUNT(*) FROM records");
  return s.Step() ? s.Int(0) : 0;
}

bool CampaignLog::StoreProgress(const StoredProgress& p) {
  SqliteTransaction t(*db_);
  SqliteStatement had(*db_,
                      "SELECT COUNT(*) FROM progress_runs WHERE as_of = ? AND "
                      "inputs_digest = ?");
  had.Bind(1, p.as_of).Bind(2, p.inputs_digest);
  const bool replaced = had.Step() && had.Int(0) > 0;
  SqliteStatement put(
      *db_,
      "INSERT INTO progress_runs (as_of, made_at, inputs_digest, records_used, runs, "
      "seed, complete, p_by_planned_end, planned_end, p50_weeks, p80_weeks, p90_weeks, "
      "p50_date, p80_date, p90_date, result_json) VALUES "
      "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?) "
      "ON CONFLICT (as_of, inputs_digest) DO UPDATE SET made_at = excluded.made_at, "
      "records_used = excluded.records_used, runs = excluded.runs, seed = excluded.seed, "
      "complete = excluded.complete, p_by_planned_end = excluded.p_by_planned_end, "
      "planned_end = excluded.planned_end, p50_weeks = excluded.p50_weeks, "
      "p80_weeks = excluded.p80_weeks, p90_weeks = excluded.p90_weeks, "
      "p50_date = excluded.p50_date, p80_date = excluded.p80_date, "
      "p90_date = excluded.p90_date, result_json = excluded.result_json");
  const double nan = std::nan("");
  put.Bind(1, p.as_of)
      .Bind(2, p.made_at_utc)
      .Bind(3, p.inputs_digest)
      .Bind(4, p.records_used)
      .Bind(5, static_cast<int64_t>(p.runs))
      .Bind(6, std::to_string(p.seed))
      .Bind(7, static_cast<int64_t>(p.complete ? 1 : 0))
      .Bind(8, p.p_by_planned_end)
      .Bind(9, p.planned_end)
      .BindOrNull(10, p.p50_weeks.value_or(nan))
      .BindOrNull(11, p.p80_weeks.value_or(nan))
      .BindOrNull(12, p.p90_weeks.value_or(nan))
      .BindOrNull(13, p.p50_date)
      .BindOrNull(14, p.p80_date)
      .BindOrNull(15, p.p90_date)
      .Bind(16, p.result_json)
      .Step();
  t.Commit();
  return replaced;
}

int64_t CampaignLog::OtherResultsFor(const std::string& as_of,
                                     const std::string& digest) const {
  SqliteStatement s(*db_,
                    "SELECT COUNT(*) FROM progress_runs WHERE as_of = ? AND "
                    "inputs_digest <> ?");
  s.Bind(1, as_of).Bind(2, digest);
  return s.Step() ? s.Int(0) : 0;
}

std::vector<StoredProgress> CampaignLog::History() const {
  std::vector<StoredProgress> out;
  SqliteStatement s(*db_,
                    "SELECT as_of, made_at, inputs_digest, records_used, runs, seed, "
                    "complete, p_by_planned_end, planned_end, p50_weeks, p80_weeks, "
                    "p90_weeks, p50_date, p80_date, p90_date, result_json "
                    "FROM progress_runs ORDER BY as_of, made_at, id");
  auto weeks = [&s](int c) {
    return s.IsNull(c) ? std::nullopt : std::optional<double>(s.Real(c));
  };
  while (s.Step()) {
    StoredProgress p;
    p.as_of = s.Text(0);
    p.made_at_utc = s.Text(1);
    p.inputs_digest = s.Text(2);
    p.records_used = s.Int(3);
    p.runs = static_cast<long>(s.Int(4));
    p.seed = std::stoull(s.Text(5));
    p.complete = s.Int(6) != 0;
    p.p_by_planned_end = s.Real(7);
    p.planned_end = s.Text(8);
    p.p50_weeks = weeks(9);
    p.p80_weeks = weeks(10);
    p.p90_weeks = weeks(11);
    p.p50_date = s.TextOrNull(12);
    p.p80_date = s.TextOrNull(13);
    p.p90_date = s.TextOrNull(14);
    p.result_json = s.Text(15);
    out.push_back(std::move(p));
  }
  return out;
}

}  // namespace planner
