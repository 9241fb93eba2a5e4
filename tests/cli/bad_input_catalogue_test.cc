// The catalogue of bad input, docs/bad-input.md, checked against the code:
// every entry's input goes to the real reader (plans, site models, met-data
// CSV) or to the real program (commands), and the message must be exactly
// the one the page shows. The markup is described at the top of that page.
#include <gtest/gtest.h>

#include <sstream>
#include <string>
#include <vector>

#include "cli/cli_runner.h"
#include "io/met_csv_reader.h"
#include "io/reader_test_util.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

struct Entry {
  std::string title;
  int line = 0;       // of the heading in the page, for failure messages
  std::string kind;   // info string of the input block, e.g. "yaml plan"
  std::string input;  // its text
  std::string message;
  int blocks = 0;  // fenced blocks seen under the heading
};

// Entries in page order. A fenced block opens with ``` and an info string and
// closes with a bare ```.
std::vector<Entry> ReadCatalogue(const std::string& text) {
  std::vector<Entry> entries;
  std::istringstream in(text);
  std::string line, info, block;
  bool in_block = false;
  int line_no = 0;
  while (std::getline(in, line)) {
    ++line_no;
    if (in_block && line == "```") {
      in_block = false;
      if (entries.empty()) continue;
      Entry& e = entries.back();
      ++e.blocks;
      if (info == "text message") {
        e.message = block.empty() ? block : block.substr(0, block.size() - 1);
      } else {
        e.kind = info;
        e.input = block;
      }
    } else if (in_block) {
      block += line + "\n";
    } else if (line.rfind("```", 0) == 0) {
      in_block = true;
      info = line.substr(3);
      block.clear();
    } else if (line.rfind("### ", 0) == 0) {
      entries.push_back(Entry{line.substr(4), line_no, "", "", "", 0});
    }
  }
  return entries;
}

std::string CsvMessage(const std::string& text) {
  std::istringstream in(text);
  MetSeries series;
  try {
    series = ReadMetCsv(in, "mast.csv", MetCsvOptions{});
  } catch (const InputError& e) {
    return e.what();
  }
  std::string out;
  for (const std::string& example : series.read.examples) {
    out += (out.empty() ? "" : "\n") + example;
  }
  return out.empty() ? "(no error)" : out;
}

// Runs "fillcast ARGS" from the repository's root; everything it prints, and
// whether it failed with the input-error status 2.
std::string CommandMessage(const std::string& command, int* exit_code) {
  const std::string args = command.substr(command.find(' ') + 1);
  const fillcast_test::Outcome o =
      fillcast_test::RunShell("cd '" + std::string(FILLCAST_SOURCE_DIR) + "' && " +
                              FILLCAST_BINARY + " " + args + " 2>&1 </dev/null");
  *exit_code = o.exit_code;
  std::string out = o.output;
  while (!out.empty() && out.back() == '\n') out.pop_back();
  return out;
}

std::string MessageOf(const Entry& e, int* exit_code) {
  *exit_code = 2;
  const std::string input = e.input;
  if (e.kind == "yaml plan") {
    // A plan next to site-models/, so that ../site-models/x.yaml resolves.
    return reader_test::ErrorOf(
        [&] { ParsePlan(input, "plan.yaml", reader_test::SourcePath("demo-site")); });
  }
  if (e.kind == "yaml site-model") {
    return reader_test::ErrorOf([&] { ParseSiteModel(input, "site.yaml"); });
  }
  if (e.kind == "csv met-data") return CsvMessage(input);
  if (e.kind == "sh command") {
    return CommandMessage(input.substr(0, input.find('\n')), exit_code);
  }
  return "unknown input kind '" + e.kind + "'";
}

TEST(BadInputCatalogueTest, EveryEntryGivesExactlyItsMessage) {
  const std::vector<Entry> entries = ReadCatalogue(
      fillcast_test::ReadFile(reader_test::SourcePath("docs/bad-input.md")));
  // The page promises a catalogue of the usual mistakes, not a sample.
  EXPECT_GE(entries.size(), 30u);
  for (const Entry& e : entries) {
    SCOPED_TRACE("docs/bad-input.md:" + std::to_string(e.line) + ": " + e.title);
    ASSERT_EQ(e.blocks, 2) << "each entry has one input block and one message block";
    ASSERT_FALSE(e.message.empty());
    int exit_code = 0;
    EXPECT_EQ(MessageOf(e, &exit_code), e.message);
    EXPECT_EQ(exit_code, 2);  // the input-error status, not a crash
  }
}

TEST(BadInputCatalogueTest, ReaderFindsEntriesAndTheirBlocks) {
  const std::vector<Entry> entries = ReadCatalogue(
      "# Title\n\n### First\n\nwords\n\n```yaml plan\na: 1\n```\n\ngives\n\n"
      "```text message\nplan.yaml:1:1: a: bad\n```\n### Second\n```sh command\n"
      "fillcast x\n```\n```text message\nline 1\nline 2\n```\n");
  ASSERT_EQ(entries.size(), 2u);
  EXPECT_EQ(entries[0].title, "First");
  EXPECT_EQ(entries[0].kind, "yaml plan");
  EXPECT_EQ(entries[0].input, "a: 1\n");
  EXPECT_EQ(entries[0].message, "plan.yaml:1:1: a: bad");
  EXPECT_EQ(entries[1].kind, "sh command");
  EXPECT_EQ(entries[1].message, "line 1\nline 2");
  EXPECT_EQ(entries[1].blocks, 2);
}

}  // namespace
}  // namespace planner
