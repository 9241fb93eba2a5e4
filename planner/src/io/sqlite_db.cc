#include "io/sqlite_db.h"

#include <sqlite3.h>

#include <cmath>
#include <limits>

#include "planner/error.h"

namespace planner {

namespace {
constexpr int kBusyTimeoutMs = 60000;
}  // namespace

SqliteDb::SqliteDb(const std::string& path, bool create) : path_(path) {
  const int flags = SQLITE_OPEN_READWRITE | (create ? SQLITE_OPEN_CREATE : 0);
  if (sqlite3_open_v2(path.c_str(), &db_, flags, nullptr) != SQLITE_OK) {
    const std::string message = db_ != nullptr ? sqlite3_errmsg(db_) : "out of memory";
    sqlite3_close(db_);
    db_ = nullptr;
    throw InputError(path + ": cannot open the campaign log: " + message);
  }
  // Wait for another fillcast holding the write lock (a large `log add`),
  // then fail with a clear message rather than at once or never.
  sqlite3_busy_timeout(db_, kBusyTimeoutMs);
}

SqliteDb::~SqliteDb() { sqlite3_close(db_); }

void SqliteDb::Exec(const std::string& sql) {
  char* message = nullptr;
  if (sqlite3_exec(db_, sql.c_str(), nullptr, nullptr, &message) != SQLITE_OK) {
    const std::string text = message != nullptr ? message : sqlite3_errmsg(db_);
    sqlite3_free(message);
    if (sqlite3_errcode(db_) == SQLITE_BUSY) {
      throw InputError(path_ + ": campaign log: another fillcast is writing it and did " +
                       "not finish within " + std::to_string(kBusyTimeoutMs / 1000) +
                       " s; run this again when it has finished");
    }
    throw InputError(path_ + ": campaign log: " + text);
  }
}

int64_t SqliteDb::LastInsertId() const { return sqlite3_last_insert_rowid(db_); }

void SqliteDb::Fail(const std::string& what) const {
  throw InputError(path_ + ": " + what + ": " + sqlite3_errmsg(db_));
}

SqliteStatement::SqliteStatement(SqliteDb& db, const std::string& sql) : db_(db) {
  if (sqlite3_prepare_v2(db.handle(), sql.c_str(), -1, &stmt_, nullptr) != SQLITE_OK) {
    db.Fail("campaign log");
  }
}

SqliteStatement::~SqliteStatement() { sqlite3_finalize(stmt_); }

SqliteStatement& SqliteStatement::Bind(int index, int64_t value) {
  if (sqlite3_bind_int64(stmt_, index, value) != SQLITE_OK) db_.Fail("campaign log");
  return *this;
}

SqliteStatement& SqliteStatement::Bind(int index, double value) {
  if (sqlite3_bind_double(stmt_, index, value) != SQLITE_OK) db_.Fail("campaign log");
  return *this;
}

SqliteStatement& SqliteStatement::Bind(int index, const std::string& value) {
  if (sqlite3_bind_text(stmt_, index, value.data(), static_cast<int>(value.size()),
                        SQLITE_TRANSIENT) != SQLITE_OK) {
    db_.Fail("campaign log");
  }
  return *this;
}

SqliteStatement& SqliteStatement::BindNull(int index) {
  if (sqlite3_bind_null(stmt_, index) != SQLITE_OK) db_.Fail("campaign log");
  return *this;
}

SqliteStatement& SqliteStatement::BindOrNull(int index, double value) {
  return std::isnan(value) ? BindNull(index) : Bind(index, value);
}

SqliteStatement& SqliteStatement::BindOrNull(int index,
                                             const std::optional<std::string>& value) {
  return value ? Bind(index, *value) : BindNull(index);
}

bool SqliteStatement::Step() {
  const int rc = sqlite3_step(stmt_);
  if (rc == SQLITE_ROW) return true;
  if (rc == SQLITE_DONE) return false;
  db_.Fail("campaign log");
}

void SqliteStatement::Reset() {
  sqlite3_reset(stmt_);
  sqlite3_clear_bindings(stmt_);
}

bool SqliteStatement::IsNull(int column) const {
  return sqlite3_column_type(stmt_, column) == SQLITE_NULL;
}

int64_t SqliteStatement::Int(int column) const {
  return sqlite3_column_int64(stmt_, column);
}

double SqliteStatement::Real(int column) const {
  return IsNull(column) ? std::numeric_limits<double>::quiet_NaN()
                        : sqlite3_column_double(stmt_, column);
}

std::string SqliteStatement::Text(int column) const {
  const unsigned char* text = sqlite3_column_text(stmt_, column);
  if (text == nullptr) return "";
  return std::string(reinterpret_cast<const char*>(text),
                     static_cast<size_t>(sqlite3_column_bytes(stmt_, column)));
}

std::optional<std::string> SqliteStatement::TextOrNull(int column) const {
  if (IsNull(column)) return std::nullopt;
  return Text(column);
}

SqliteTransaction::SqliteTransaction(SqliteDb& db) : db_(db) {
  db_.Exec("BEGIN IMMEDIATE");
}

SqliteTransaction::~SqliteTransaction() {
  if (open_) sqlite3_exec(db_.handle(), "ROLLBACK", nullptr, nullptr, nullptr);
}

void SqliteTransaction::Commit() {
  db_.Exec("COMMIT");
  open_ = false;
}

}  // namespace planner
