// The campaign log: records keyed by time, idempotent ingests, conflicting
// duplicates reported and never written, one transaction per ingest (a
// process killed half-way leaves the log as it was), stored progress.
#include "planner/campaign_log.h"

#include <gtest/gtest.h>
#include <signal.h>
#include <sys/wait.h>
#include <unistd.h>

#include <cstdio>
#include <filesystem>
#include <fstream>
#include <iterator>
#include <sstream>

#include "io/met_csv_reader.h"
#include "io/reader_test_util.h"
#include "io/records_csv_reader.h"
#include "io/sqlite_db.h"
#include "planner/calendar.h"
#include "planner/error.h"

namespace planner {
namespace {

namespace fs = std::filesystem;

const char kHeader[] = "timestamp,speed_ms,speed_std_ms,direction_deg,state,quality\n";

// n records every 10 minutes from 2027-03-01 00:00 + first * 10 min; speed
// from the index so that every record differs.
std::string Csv(int first, int n, double speed_shift = 0.0) {
  std::string out = kHeader;
  const int64_t t0 = DateTime(Date{2027, 3, 1});
  for (int i = first; i < first + n; ++i) {
    std::ostringstream row;
    row << FormatTimestamp(t0 + i * 600LL, true) << ","
        << 5.0 + (i % 97) * 0.1 + speed_shift << ",0.5," << (i * 7) % 360
        << ",production,ok\n";
    out += row.str();
  }
  return out;
}

std::vector<LoggedRow> Rows(const std::string& csv, const std::string& name) {
  std::istringstream in(csv);
  return ReadRecordsCsv(in, name, {}).rows;
}

class CampaignLogTest : public ::testing::Test {
 protected:
  void SetUp() override {
    dir_ = fs::temp_directory_path() /
           ("fillcast-log-" + std::to_string(::getpid()) + "-" +
            ::testing::UnitTest::GetInstance()->current_test_info()->name());
    fs::remove_all(dir_);
    fs::create_directories(dir_);
    path_ = (dir_ / "plan.campaign.sqlite").string();
  }
  void TearDown() override { fs::remove_all(dir_); }

  IngestReport Add(CampaignLog& log, const std::string& csv, const std::string& name) {
    IngestOptions o;
    o.now_utc = "2027-07-01T00:00:00Z";
    return log.Ingest(name, Rows(csv, name), o);
  }
  std::string Bytes() const {
    std::ifstream in(path_, std::ios::binary);
    return std::string((std::istreambuf_iterator<char>(in)),
                       std::istreambuf_iterator<char>());
  }

  fs::path dir_;
  std::string path_;
};

TEST_F(CampaignLogTest, DefaultPathIsBesideThePlan) {
  EXPECT_EQ(CampaignLog::DefaultPath("demo-site/plan.yaml"),
            "demo-site/plan.campaign.sqlite");
  EXPECT_EQ(CampaignLog::DefaultPath("plan.yaml"), "plan.campaign.sqlite");
}

TEST_F(CampaignLogTest, IngestingTheSameFileTwiceChangesNothing) {
  CampaignLog log(path_, true, "test plan");
  const IngestReport first = Add(log, Csv(0, 500), "a.csv");
  EXPECT_EQ(first.added, 500);
  EXPECT_EQ(first.already_logged, 0);
  const std::string before = Bytes();
  const IngestReport again = Add(log, Csv(0, 500), "a.csv");
  EXPECT_EQ(again.added, 0);
  EXPECT_EQ(again.already_logged, 500);
  EXPECT_EQ(again.conflicting, 0);
  EXPECT_EQ(log.RecordCount(), 500);
  EXPECT_EQ(Bytes(), before);  // an ingest that adds nothing writes nothing
}

TEST_F(CampaignLogTest, OverlappingFilesCountEachTimestampOnce) {
  CampaignLog log(path_, true);
  Add(log, Csv(0, 300), "a.csv");
  const IngestReport b = Add(log, Csv(200, 300), "b.csv");  // 100 overlap
  EXPECT_EQ(b.added, 200);
  EXPECT_EQ(b.already_logged, 100);
  const std::vector<LoggedRecord> records = log.Records();
  ASSERT_EQ(records.size(), 500u);
  for (size_t i = 1; i < records.size(); ++i) {
    EXPECT_EQ(records[i].time_s - records[i - 1].time_s, 600);
  }
}

TEST_F(CampaignLogTest, ConflictingDuplicatesAreReportedAndNotWritten) {
  CampaignLog log(path_, true);
  Add(log, Csv(0, 10), "a.csv");
  // Rows 5-14: 5-9 already logged with other speeds, 10-14 new.
  const IngestReport r = Add(log, Csv(5, 10, 0.5), "b.csv");
  EXPECT_EQ(r.added, 5);
  EXPECT_EQ(r.conflicting, 5);
  ASSERT_EQ(r.conflicts.size(), 5u);
  EXPECT_EQ(r.conflicts[0].where, "b.csv:2");
  EXPECT_EQ(r.conflicts[0].logged_from, "a.csv:7");
  EXPECT_EQ(r.conflicts[0].difference, "speed_ms 5.5 logged, 6 here");
  EXPECT_DOUBLE_EQ(log.Records()[5].speed_ms, 5.5);  // the logged value is kept
}

TEST_F(CampaignLogTest, ConflictsWithinOneFileAreReportedToo) {
  CampaignLog log(path_, true);
  const std::string csv = std::string(kHeader) +
                          "2027-03-01 00:00,5,0.5,10,production,ok\n"
                          "2027-03-01 00:00,5,0.5,10,production,ok\n"
                          "2027-03-01 00:00,5,0.5,10,parked,ok\n";
  const IngestReport r = Add(log, csv, "c.csv");
  EXPECT_EQ(r.added, 1);
  EXPECT_EQ(r.already_logged, 1);
  EXPECT_EQ(r.conflicting, 1);
  ASSERT_EQ(r.conflicts.size(), 1u);
  EXPECT_EQ(r.conflicts[0].where, "c.csv:4");
  EXPECT_EQ(r.conflicts[0].logged_from, "c.csv:2");
  EXPECT_EQ(r.conflicts[0].difference, "state production logged, parked here");
}

// A child process ingests a large file and kills itself (SIGKILL: no
// destructor, no rollback by us) half-way through the transaction. The log
// must then be byte for byte what it was, and still open and read.
TEST_F(CampaignLogTest, KilledIngestLeavesTheLogAsItWas) {
  {
    CampaignLog log(path_, true);
    Add(log, Csv(0, 1000), "before.csv");
  }
  const std::string before = Bytes();
  const std::vector<LoggedRow> big = Rows(Csv(1000, 20000), "big.csv");
  const pid_t child = fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    CampaignLog log(path_, false);
    IngestOptions o;
    o.now_utc = "2027-07-01T00:00:00Z";
    o.after_row = [](int64_t done) {
      if (done == 12345) ::kill(::getpid(), SIGKILL);
    };
    log.Ingest("big.csv", big, o);
    ::_exit(0);  // not reached
  }
  int status = 0;
  ASSERT_EQ(waitpid(child, &status, 0), child);
  ASSERT_TRUE(WIFSIGNALED(status));
  EXPECT_EQ(WTERMSIG(status), SIGKILL);
  // The hot journal shows that the transaction was under way when killed.
  EXPECT_TRUE(fs::exists(path_ + "-journal"));
  {
    CampaignLog log(path_, false);  // opening rolls the journal back
    EXPECT_EQ(log.RecordCount(), 1000);
    EXPECT_EQ(log.Records().back().time_s, DateTime(Date{2027, 3, 1}) + 999 * 600);
  }
  EXPECT_EQ(Bytes(), before);
  CampaignLog log(path_, false);
  EXPECT_EQ(Add(log, Csv(1000, 20000), "big.csv").added, 20000);  // and works on
}

TEST_F(CampaignLogTest, AFileThatIsNoLogIsRefused) {
  const std::string other = (dir_ / "notes.txt").string();
  std::ofstream(other) << "not a database\n";
  EXPECT_EQ(reader_test::ErrorOf([&] { CampaignLog log(other, false); }),
            other +
                ": is not a fillcast campaign log (expected an SQLite file with a meta "
                "table naming the format); choose another file with --log");
  EXPECT_EQ(reader_test::ErrorOf([&] { CampaignLog log(path_, false); }),
            path_ +
                ": no campaign log here; add logged records first with 'fillcast log "
                "add PLAN RECORDS.csv' (or name the log with --log)");
}

TEST_F(CampaignLogTest, StoredProgressIsReplacedOnlyForTheSameInputs) {
  CampaignLog log(path_, true);
  StoredProgress p;
  p.as_of = "2027-05-01";
  p.made_at_utc = "2027-05-01T08:00:00Z";
  p.inputs_digest = "aaaa";
  p.runs = 100;
  p.seed = 18446744073709551615ULL;  // the largest seed survives the round trip
  p.p_by_planned_end = 0.4;
  p.p50_weeks = 40.0;
  p.p50_date = "2027-12-06";
  p.planned_end = "2028-03-01";
  p.result_json = "{}";
  EXPECT_FALSE(log.StoreProgress(p));
  p.runs = 200;
  p.made_at_utc = "2027-05-01T09:00:00Z";
  EXPECT_TRUE(log.StoreProgress(p));  // same date, same inputs: replaced
  p.inputs_digest = "bbbb";
  EXPECT_FALSE(log.StoreProgress(p));  // other inputs: kept beside it
  EXPECT_EQ(log.OtherResultsFor("2027-05-01", "bbbb"), 1);
  const std::vector<StoredProgress> h = log.History();
  ASSERT_EQ(h.size(), 2u);
  EXPECT_EQ(h[0].runs, 200);
  EXPECT_EQ(h[0].seed, 18446744073709551615ULL);
  EXPECT_FALSE(h[0].p80_weeks.has_value());
  EXPECT_EQ(*h[0].p50_date, "2027-12-06");
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

class CampaignLogBatchTest : public CampaignLogTest {};

// `log add` of several files is one transaction: a process killed in the
// second file leaves none of the first in the log.
TEST_F(CampaignLogBatchTest, KilledBatchAddsNoneOfItsFiles) {
  { CampaignLog log(path_, true); }
  const std::vector<LoggedRow> first = Rows(Csv(0, 3000), "a.csv");
  const std::vector<LoggedRow> second = Rows(Csv(3000, 3000), "b.csv");
  const pid_t child = fork();
  ASSERT_GE(child, 0);
  if (child == 0) {
    CampaignLog log(path_, false);
    IngestOptions o;
    o.after_row = [](int64_t done) {
      if (done == 1500) {
        static int files_started = 0;
        if (++files_started == 2) ::kill(::getpid(), SIGKILL);
      }
    };
    log.IngestAll({{"a.csv", &first}, {"b.csv", &second}}, o);
    ::_exit(0);  // not reached
  }
  int status = 0;
  ASSERT_EQ(waitpid(child, &status, 0), child);
  ASSERT_TRUE(WIFSIGNALED(status));
  CampaignLog log(path_, false);
  EXPECT_EQ(log.RecordCount(), 0);
  const std::vector<IngestReport> reports =
      log.IngestAll({{"a.csv", &first}, {"b.csv", &second}}, {});
  ASSERT_EQ(reports.size(), 2u);
  EXPECT_EQ(reports[0].added, 3000);
  EXPECT_EQ(reports[1].added, 3000);
  EXPECT_EQ(log.RecordCount(), 6000);
}

// Several processes creating the same log at once: the first makes it, the
// others wait for its write lock and then use it. None fails with "table
// already exists".
TEST_F(CampaignLogBatchTest, ProcessesCreatingOneLogAtOnceAllSucceed) {
  const std::vector<LoggedRow> rows = Rows(Csv(0, 2000), "a.csv");
  std::vector<pid_t> children;
  for (int i = 0; i < 4; ++i) {
    const pid_t child = fork();
    ASSERT_GE(child, 0);
    if (child == 0) {
      try {
        CampaignLog log(path_, true, "plan");
        log.IngestAll({{"a.csv", &rows}}, {});
      } catch (const InputError& e) {
        std::fprintf(stderr, "%s\n", e.what());
        ::_exit(2);
      }
      ::_exit(0);
    }
    children.push_back(child);
  }
  for (const pid_t child : children) {
    int status = 0;
    ASSERT_EQ(waitpid(child, &status, 0), child);
    EXPECT_TRUE(WIFEXITED(status) && WEXITSTATUS(status) == 0);
  }
  CampaignLog log(path_, false);
  EXPECT_EQ(log.RecordCount(), 2000);
}

}  // namespace
}  // namespace planner

namespace planner {
namespace {

// A log written before the load-channel column (schema version 1) is brought
// to version 2 when opened: its records are kept, read back with every group
// recording, and new records may carry groups down.
TEST_F(CampaignLogTest, VersionOneLogGainsTheChannelColumnAndKeepsItsRecords) {
  {
    CampaignLog log(path_, true);
    Add(log, Csv(0, 20), "a.csv");
  }
  {
    SqliteDb db(path_, false);
    db.Exec(
        "ALTER TABLE records DROP COLUMN channels_down;"
        "UPDATE meta SET value = '1' WHERE key = 'schema_version';");
  }
  const std::vector<LoggedRow> before = Rows(Csv(0, 20), "a.csv");
  {
    CampaignLog log(path_, false);
    const std::vector<LoggedRecord> records = log.Records();
    ASSERT_EQ(records.size(), 20u);
    for (size_t i = 0; i < records.size(); ++i) {
      EXPECT_EQ(records[i].time_s, before[i].record.time_s);
      EXPECT_EQ(records[i].speed_ms, before[i].record.speed_ms);
      EXPECT_EQ(records[i].channels_down, "");
    }
    std::string csv = Csv(20, 2);
    csv.replace(csv.find("quality\n"), 8, "quality,channels_down\n");
    for (size_t at = csv.find(",ok\n"); at != std::string::npos;
         at = csv.find(",ok\n", at + 1))
      csv.replace(at, 4, ",ok,blade;tower\n");
    Add(log, csv, "b.csv");
    EXPECT_EQ(log.Records().back().channels_down, "blade;tower");
  }
  SqliteDb db(path_, false);
  SqliteStatement version(db, "SELECT value FROM meta WHERE key = 'schema_version'");
  ASSERT_TRUE(version.Step());
  EXPECT_EQ(version.Text(0), std::to_string(kCampaignLogSchemaVersion));
}

}  // namespace
}  // namespace planner
