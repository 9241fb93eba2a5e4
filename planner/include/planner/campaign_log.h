// The campaign log: one SQLite file (by default beside the plan,
// <plan-folder>/<plan-stem>.campaign.sqlite) holding every 10-minute record
// the campaign has logged and every progress forecast made from it. The
// schema is specified in docs/progress.md; its version is in the `meta`
// table and a log of a newer version is refused.
//
// Guarantees:
//  * Records are keyed by the start of their 10-minute period (UTC). Adding
//    a record that is already logged with the same values changes nothing;
//    one with other values (a conflicting duplicate, also within one file) is
//    reported with its file and line and never overwrites the logged one.
//  * An ingest is one transaction (BEGIN IMMEDIATE ... COMMIT): a process
//    killed half-way leaves the log as it was (SQLite rolls the journal back
//    when the file is next opened). An ingest that adds nothing writes
//    nothing.
// Errors: InputError naming the log file (not a fillcast log, a newer
// schema, locked, read-only...).
#ifndef PLANNER_CAMPAIGN_LOG_H_
#define PLANNER_CAMPAIGN_LOG_H_

#include <cstdint>
#include <functional>
#include <memory>
#include <optional>
#include <string>
#include <vector>

#include "planner/logged_counts.h"

namespace planner {

class SqliteDb;

// Version of the log schema this program writes and reads.
// 2: records.channels_down (load-channel groups down). A version-1 log is
// brought to version 2 when it is opened (the column added, empty: every
// group recording), which loses nothing.
inline constexpr int kCampaignLogSchemaVersion = 2;

// A record read from a file, with the line it came from (for messages).
struct LoggedRow {
  LoggedRecord record;
  int64_t line = 0;
};

struct IngestOptions {
  // Time of the ingest, stored with it ("2027-07-01T09:12:00Z"); the caller
  // supplies it so that the log code reads no clock.
  std::string now_utc;
  // Called after each row is written, inside the transaction (tests use it
  // to kill the process half-way). Null = none.
  std::function<void(int64_t rows_done)> after_row;
};

// A row whose timestamp is already logged with other values.
struct IngestConflict {
  std::string where;        // "file:line" of the row
  int64_t time_s = 0;       // its timestamp
  std::string logged_from;  // "file:line" the logged record came from
  std::string difference;   // "speed_ms 7.4 logged, 7.9 here; state ..."
};

struct IngestReport {
  std::string file;
  int64_t rows = 0;            // rows read from the file
  int64_t added = 0;           // new records
  int64_t already_logged = 0;  // identical to a logged record (or an earlier row)
  int64_t conflicting = 0;     // other values than the logged record
  std::vector<IngestConflict> conflicts;  // the first kMaxListedConflicts
  int64_t records_in_log = 0;             // after the ingest
};
inline constexpr int kMaxListedConflicts = 20;

// One stored progress forecast (docs/progress.md, table progress_runs).
struct StoredProgress {
  std::string as_of;          // YYYY-MM-DD
  std::string made_at_utc;    // when it was made
  std::string inputs_digest;  // 16 hex digits over plan, site model and records used
  int64_t records_used = 0;
  long runs = 0;
  uint64_t seed = 0;
  bool complete = false;  // the logged matrix was already full
  double p_by_planned_end = 0;
  // Completion weeks from the plan's start and done-by dates; nullopt = not
  // reached within the horizon.
  std::optional<double> p50_weeks, p80_weeks, p90_weeks;
  std::optional<std::string> p50_date, p80_date, p90_date;
  std::string planned_end;  // the plan's deadline, YYYY-MM-DD
  std::string result_json;  // the full JSON document of the run
};

class CampaignLog {
 public:
  // <plan-folder>/<plan-stem>.campaign.sqlite
  static std::string DefaultPath(const std::string& plan_path);

  // Opens the log at path; create: make it (with its schema) if missing,
  // otherwise a missing file is an InputError. plan_name is stored when the
  // log is created.
  CampaignLog(const std::string& path, bool create, const std::string& plan_name = "");
  ~CampaignLog();
  CampaignLog(CampaignLog&&) noexcept;
  CampaignLog(const CampaignLog&) = delete;
  CampaignLog& operator=(const CampaignLog&) = delete;

  // Adds the rows of `file` as described above, in one transaction.
  IngestReport Ingest(const std::string& file, const std::vector<LoggedRow>& rows,
                      const IngestOptions& options);

  // Adds several files in one transaction: all of them or, if the process
  // stops part-way, none.
  struct IngestInput {
    std::string file;
    const std::vector<LoggedRow>* rows = nullptr;  // not owned
  };
  std::vector<IngestReport> IngestAll(const std::vector<IngestInput>& files,
                                      const IngestOptions& options);

  // Every logged record, in time order.
  std::vector<LoggedRecord> Records() const;
  int64_t RecordCount() const;

  // Stores a progress forecast. A stored result for the same as-of date and
  // the same inputs digest is replaced (returns true); results for the same
  // date made from other inputs are kept beside it.
  bool StoreProgress(const StoredProgress& p);
  // Stored results for `as_of` made from other inputs than `digest`.
  int64_t OtherResultsFor(const std::string& as_of, const std::string& digest) const;
  // Every stored progress forecast, by as-of date, then by when it was made.
  std::vector<StoredProgress> History() const;

  const std::string& path() const { return path_; }

 private:
  void CheckOrCreateSchema(bool create, const std::string& plan_name);
  std::string MigrateFromVersion1();
  IngestReport IngestRows(const std::string& file, const std::vector<LoggedRow>& rows,
                          const IngestOptions& options);

  std::string path_;
  std::unique_ptr<SqliteDb> db_;
};

}  // namespace planner

#endif  // PLANNER_CAMPAIGN_LOG_H_
