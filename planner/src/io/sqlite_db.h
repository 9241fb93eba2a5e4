// A small RAII wrapper over SQLite's C API (https://sqlite.org/c3ref/intro.html):
// one open database, prepared statements with typed binds and columns, and a
// transaction guard that rolls back unless committed. Only what the campaign
// log (planner/campaign_log.h) needs.
//
// Errors: every failing SQLite call throws InputError naming the database
// file and SQLite's own message (a locked, read-only or damaged file is a
// problem with what the user gave us, not a bug).
#ifndef PLANNER_IO_SQLITE_DB_H_
#define PLANNER_IO_SQLITE_DB_H_

#include <cstdint>
#include <optional>
#include <string>

struct sqlite3;
struct sqlite3_stmt;

namespace planner {

class SqliteDb;

// A prepared statement. Binds are 1-based (SQLite's convention), columns
// 0-based. Step() returns true while there is a row to read.
class SqliteStatement {
 public:
  SqliteStatement(SqliteDb& db, const std::string& sql);
  ~SqliteStatement();
  SqliteStatement(const SqliteStatement&) = delete;
  SqliteStatement& operator=(const SqliteStatement&) = delete;

  SqliteStatement& Bind(int index, int64_t value);
  SqliteStatement& Bind(int index, double value);
  SqliteStatement& Bind(int index, const std::string& value);
  SqliteStatement& BindNull(int index);
  // A NaN double and an empty optional are bound as NULL.
  SqliteStatement& BindOrNull(int index, double value);
  SqliteStatement& BindOrNull(int index, const std::optional<std::string>& value);

  bool Step();
  void Reset();  // ready to bind and step again (binds are cleared)

  bool IsNull(int column) const;
  int64_t Int(int column) const;
  double Real(int column) const;  // NaN for NULL
  std::string Text(int column) const;
  std::optional<std::string> TextOrNull(int column) const;

 private:
  SqliteDb& db_;
  sqlite3_stmt* stmt_ = nullptr;
};

class SqliteDb {
 public:
  // Opens (create = also creates) the database file at path.
  SqliteDb(const std::string& path, bool create);
  ~SqliteDb();
  SqliteDb(const SqliteDb&) = delete;
  SqliteDb& operator=(const SqliteDb&) = delete;

  // Runs SQL without results (several statements allowed).
  void Exec(const std::string& sql);
  // Rowid of the last row inserted through this connection.
  int64_t LastInsertId() const;
  const std::string& path() const { return path_; }
  sqlite3* handle() const { return db_; }
  // Throws InputError "path: what: SQLite's message".
  [[noreturn]] void Fail(const std::string& what) const;

 private:
  std::string path_;
  sqlite3* db_ = nullptr;
};

// BEGIN IMMEDIATE on construction (takes the write lock at once, so two
// ingests never interleave); ROLLBACK on destruction unless Commit() ran.
class SqliteTransaction {
 public:
  explicit SqliteTransaction(SqliteDb& db);
  ~SqliteTransaction();
  SqliteTransaction(const SqliteTransaction&) = delete;
  SqliteTransaction& operator=(const SqliteTransaction&) = delete;
  void Commit();

 private:
  SqliteDb& db_;
  bool open_ = true;
};

}  // namespace planner

#endif  // PLANNER_IO_SQLITE_DB_H_
