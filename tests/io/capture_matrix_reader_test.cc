// The capture_matrix section of a plan: bin forms, grid layout and cell
// order, overrides, and every rejected input with its exact message.
#include <gtest/gtest.h>

#include <string>
#include <vector>

#include "io/reader_test_util.h"
#include "planner/capture_matrix.h"
#include "planner/plan_reader.h"

namespace planner {
namespace {

using reader_test::ErrorOf;
using reader_test::Replace;
using reader_test::SourcePath;

// Nine lines; lines 5-9 are the matrix the cases edit or extend.
const std::string kBase =
    reader_test::PlanHead("Matrix test") +
    "capture_matrix:\n"
    "  production:\n"
    "    wind_bins_ms: [4, 5, 6, 7]\n"
    "    ti_bins_pct: [0, 8, 12]\n"
    "    min_records: 10\n";

const std::string kParked =
    "  parked:\n"
    "    wind_bins_ms: [[0, 3], [25, 30]]\n"
    "    min_records: 2\n";

CaptureMatrix Matrix(const std::string& text) {
  return ParsePlan(text, "plan.yaml", SourcePath("site-models")).matrix;
}

std::string MatrixError(const std::string& text) {
  return ErrorOf([&] { Matrix(text); });
}

// Each grid position points at a cell with the grid's state and bins, or at
// nothing (-1); every record cell is pointed at exactly once, and the event
// cells (not in any grid) come after all record cells.
void ExpectConsistentGrids(const CaptureMatrix& m) {
  std::vector<int> references(m.cells.size(), 0);
  for (const StateGrid& g : m.grids) {
    const std::size_t ti_count = g.ti_bins_pct.empty() ? 1 : g.ti_bins_pct.size();
    ASSERT_EQ(g.cell_index.size(), g.wind_bins_ms.size() * ti_count);
    for (std::size_t w = 0; w < g.wind_bins_ms.size(); ++w) {
      for (std::size_t t = 0; t < ti_count; ++t) {
        const int index = g.cell_index[w * ti_count + t];
        if (index < 0) continue;
        ASSERT_LT(index, static_cast<int>(m.cells.size()));
        const Cell& c = m.cells[index];
        ++references[index];
        EXPECT_EQ(c.state, g.state);
        EXPECT_DOUBLE_EQ(c.wind_ms.lo, g.wind_bins_ms[w].lo);
        EXPECT_EQ(c.ti_binned, !g.ti_bins_pct.empty());
        if (c.ti_binned && !g.ti_bins_pct.empty()) {
          EXPECT_DOUBLE_EQ(c.ti_pct.lo, g.ti_bins_pct[t].lo);
        }
        EXPECT_GE(c.required, 1);
      }
    }
  }
  bool events_started = false;
  for (std::size_t i = 0; i < m.cells.size(); ++i) {
    const bool is_event = m.cells[i].event >= 0;
    events_started = events_started || is_event;
    EXPECT_EQ(is_event, events_started) << "record cell after an event cell: " << i;
    EXPECT_EQ(references[i], is_event ? 0 : 1) << i;
    if (is_event) {
      EXPECT_LT(m.cells[i].event, static_cast<int>(m.event_types.size()));
    }
  }
}

TEST(CaptureMatrixReaderTest, CellsAreWindMajorThenTi) {
  const CaptureMatrix m = Matrix(kBase);
  ASSERT_EQ(m.grids.size(), 1u);
  ASSERT_EQ(m.cells.size(), 6u);
  EXPECT_EQ(m.grids[0].cell_index, (std::vector<int>{0, 1, 2, 3, 4, 5}));
  const Cell& c = m.cells[3];  // wind bin 1, TI bin 1
  EXPECT_EQ(c.state, OperatingState::kProduction);
  EXPECT_DOUBLE_EQ(c.wind_ms.lo, 5.0);
  EXPECT_DOUBLE_EQ(c.wind_ms.hi, 6.0);
  EXPECT_TRUE(c.ti_binned);
  EXPECT_DOUBLE_EQ(c.ti_pct.lo, 8.0);
  EXPECT_DOUBLE_EQ(c.ti_pct.hi, 12.0);
  EXPECT_EQ(c.required, 10);
  EXPECT_FALSE(c.optional);
  ExpectConsistentGrids(m);
}

TEST(CaptureMatrixReaderTest, OverridesRemoveAndReweightCellsAndParkedComesLast) {
  const std::string text =
      kBase +
      "    overrides:\n"
      "      - {wind_ms: [6, 7], min_records: 4}\n"
      "      - {wind_ms: [4, 5], ti_pct: [0, 8], optional: true}\n"
      "      - {wind_ms: [5, 6], ti_pct: [8, 12], min_records: 0}\n" +
      kParked;
  const CaptureMatrix m = Matrix(text);
  ASSERT_EQ(m.grids.size(), 2u);
  EXPECT_EQ(m.grids[0].cell_index, (std::vector<int>{0, 1, 2, -1, 3, 4}));
  EXPECT_TRUE(m.cells[0].optional);
  EXPECT_FALSE(m.cells[1].optional);
  EXPECT_EQ(m.cells[2].required, 10);
  EXPECT_EQ(m.cells[3].required, 4);
  EXPECT_EQ(m.cells[4].required, 4);
  EXPECT_EQ(m.grids[1].state, OperatingState::kParked);
  EXPECT_TRUE(m.grids[1].ti_bins_pct.empty());
  EXPECT_EQ(m.grids[1].cell_index, (std::vector<int>{5, 6}));
  ASSERT_EQ(m.cells.size(), 7u);
  EXPECT_FALSE(m.cells[6].ti_binned);
  EXPECT_DOUBLE_EQ(m.cells[6].wind_ms.lo, 25.0);
  EXPECT_DOUBLE_EQ(m.cells[6].wind_ms.hi, 30.0);
  EXPECT_EQ(m.cells[6].required, 2);
  ExpectConsistentGrids(m);
}

TEST(CaptureMatrixReaderTest, LaterOverridesWin) {
  const std::string text = kBase +
                           "    overrides:\n"
                           "      - {wind_ms: [4, 7], min_records: 3}\n"
                           "      - {wind_ms: [5, 6], min_records: 8}\n";
  const CaptureMatrix m = Matrix(text);
  EXPECT_EQ(m.cells[0].required, 3);
  EXPECT_EQ(m.cells[2].required, 8);
  EXPECT_EQ(m.cells[3].required, 8);
  EXPECT_EQ(m.cells[5].required, 3);
}

TEST(CaptureMatrixReaderTest, RangeFormMakesEqualBinsEndingExactlyOnTo) {
  const std::string text =
      Replace(kBase, "[4, 5, 6, 7]", "{from: 3, to: 4, width: 0.1}") +
      "    overrides: [{wind_ms: [3.7, 4], min_records: 1}]\n";
  const CaptureMatrix m = Matrix(text);
  const StateGrid& g = m.grids[0];
  ASSERT_EQ(g.wind_bins_ms.size(), 10u);
  EXPECT_DOUBLE_EQ(g.wind_bins_ms[0].lo, 3.0);
  EXPECT_EQ(g.wind_bins_ms[9].hi, 4.0);
  for (std::size_t i = 1; i < g.wind_bins_ms.size(); ++i) {
    EXPECT_EQ(g.wind_bins_ms[i].lo, g.wind_bins_ms[i - 1].hi);  // contiguous
    EXPECT_NEAR(g.wind_bins_ms[i].lo, 3.0 + 0.1 * static_cast<double>(i), 1e-12);
  }
  // Bins 3.7-3.8, 3.8-3.9 and 3.9-4, two TI bins each: the last six cells.
  for (std::size_t i = 0; i < m.cells.size(); ++i) {
    EXPECT_EQ(m.cells[i].required, i >= 14 ? 1 : 10) << i;
  }
}

TEST(CaptureMatrixReaderTest, PairsAllowGapsAndNoTiBinsIndexByWindAlone) {
  const std::string text = Replace(Replace(kBase, "[4, 5, 6, 7]", "[[4, 5], [8, 10]]"),
                                   "    ti_bins_pct: [0, 8, 12]\n", "");
  const CaptureMatrix m = Matrix(text);
  ASSERT_EQ(m.cells.size(), 2u);
  EXPECT_FALSE(m.cells[1].ti_binned);
  EXPECT_DOUBLE_EQ(m.cells[1].wind_ms.lo, 8.0);
  EXPECT_DOUBLE_EQ(m.cells[1].wind_ms.hi, 10.0);
  EXPECT_EQ(m.grids[0].cell_index, (std::vector<int>{0, 1}));
}

TEST(CaptureMatrixReaderTest, BinsOutsideProductionRangeAreFineWhenRemoved) {
  const std::string text = Replace(kBase, "[4, 5, 6, 7]", "[1, 2, 3, 4]") +
                           "    overrides: [{wind_ms: [1, 3], min_records: 0}]\n";
  const CaptureMatrix m = Matrix(text);
  ASSERT_EQ(m.cells.size(), 2u);
  EXPECT_DOUBLE_EQ(m.cells[0].wind_ms.lo, 3.0);
  EXPECT_EQ(m.grids[0].cell_index, (std::vector<int>{-1, -1, -1, -1, 0, 1}));
}

TEST(CaptureMatrixReaderTest, ParkedAloneIsAMatrix) {
  const std::string text = Replace(kBase,
                                   "  production:\n"
                                   "    wind_bins_ms: [4, 5, 6, 7]\n"
                                   "    ti_bins_pct: [0, 8, 12]\n"
                                   "    min_records: 10\n",
                                   kParked);
  const CaptureMatrix m = Matrix(text);
  ASSERT_EQ(m.grids.size(), 1u);
  EXPECT_EQ(m.grids[0].state, OperatingState::kParked);
  EXPECT_EQ(m.cells.size(), 2u);
}

TEST(CaptureMatrixReaderTest, DemoPlanGridsAreConsistent) {
  ExpectConsistentGrids(LoadPlan(SourcePath("demo-site/plan.yaml")).matrix);
}

struct BadMatrix {
  const char* name;
  std::string text;
  std::string message;
};

const char kBinForms[] =
    "give {from, to, width}, a list of edges like [3, 4, 5] or a list of [lo, hi] pairs";
const std::string kWind = "capture_matrix.production.wind_bins_ms";
const std::string kOverride = "capture_matrix.production.overrides[0]";

std::string WithWind(const std::string& bins) {
  return Replace(kBase, "[4, 5, 6, 7]", bins);
}
std::string WithOverride(const std::string& entry) {
  return kBase + "    overrides:\n      - " + entry + "\n";
}

std::vector<BadMatrix> BadMatrices() {
  return {
      {"no state", kBase.substr(0, kBase.find("capture_matrix")) + "capture_matrix: {}\n",
       "plan.yaml:5:17: capture_matrix: has no cells; give production, parked, reduced "
       "or events"},
      {"unknown state", Replace(kBase, "production:", "idle:"),
       "plan.yaml:6:3: capture_matrix.idle: unknown field; valid fields: production, "
       "parked, reduced, events"},
      {"missing wind bins", Replace(kBase, "    wind_bins_ms: [4, 5, 6, 7]\n", ""),
       "plan.yaml:7:5: " + kWind + ": required field is missing"},
      {"width does not divide", WithWind("{from: 4, to: 8, width: 3}"),
       "plan.yaml:7:43: " + kWind + ".width: 3 does not divide 4-8 m/s into whole bins"},
      {"to below from", WithWind("{from: 8, to: 4, width: 1}"),
       "plan.yaml:7:33: " + kWind + ".to: 4 must be above from (8)"},
      {"negative from", WithWind("{from: -1, to: 8, width: 1}"),
       "plan.yaml:7:26: " + kWind + ".from: -1 is out of range; must be at least 0 m/s"},
      {"too many bins", WithWind("{from: 0, to: 30, width: 0.01}"),
       "plan.yaml:7:44: " + kWind +
           ".width: 0.01 gives 3000 bins; at most 1000 are allowed"},
      {"edges not increasing", WithWind("[4, 5, 5, 6]"),
       "plan.yaml:7:26: " + kWind +
           "[2]: 5 is not above the previous edge (5); edges must "
           "increase"},
      {"single edge", WithWind("[4]"),
       "plan.yaml:7:19: " + kWind + ": gives a single edge; a bin needs two: [lo, hi]"},
      {"empty list", WithWind("[]"),
       "plan.yaml:7:19: " + kWind + ": is empty; " + kBinForms},
      {"bins as text", WithWind("fast"),
       "plan.yaml:7:19: " + kWind + ": expected bins, got 'fast'; " + kBinForms},
      {"overlapping pairs", WithWind("[[4, 6], [5, 7]]"),
       "plan.yaml:7:28: " + kWind +
           "[1]: [5, 7] overlaps or comes before the previous bin "
           "(4-6 m/s); bins must be sorted and must not overlap (gaps are allowed)"},
      {"empty pair", WithWind("[[4, 4]]"),
       "plan.yaml:7:20: " + kWind + "[0]: [4, 4] is an empty bin; lo must be below hi"},
      {"edges mixed with pairs", WithWind("[4, [5, 6]]"),
       "plan.yaml:7:23: " + kWind + "[1]: mixes edges and [lo, hi] pairs in one list; " +
           kBinForms},
      {"TI edges not increasing", Replace(kBase, "[0, 8, 12]", "[0, 12, 8]"),
       "plan.yaml:8:26: capture_matrix.production.ti_bins_pct[2]: 8 is not above the "
       "previous edge (12); edges must increase"},
      {"negative min_records", Replace(kBase, "min_records: 10", "min_records: -1"),
       "plan.yaml:9:18: capture_matrix.production.min_records: -1 is out of range; must "
       "be "
       "at least 0 and at most 1000000"},
      {"fractional min_records", Replace(kBase, "min_records: 10", "min_records: 2.5"),
       "plan.yaml:9:18: capture_matrix.production.min_records: expected a whole number, "
       "got "
       "'2.5'"},
      {"override matches no cell", WithOverride("{wind_ms: [20, 25], min_records: 5}"),
       "plan.yaml:11:19: " + kOverride +
           ".wind_ms: [20, 25] covers no bin; the bins run "
           "from 4 to 7 m/s"},
      {"override cuts a bin", WithOverride("{wind_ms: [4.5, 7], min_records: 5}"),
       "plan.yaml:11:19: " + kOverride +
           ".wind_ms: [4.5, 7] cuts through the bin 4-5 m/s; "
           "start and end the range on bin edges"},
      {"override empty range", WithOverride("{wind_ms: [5, 5], min_records: 5}"),
       "plan.yaml:11:19: " + kOverride +
           ".wind_ms: [5, 5] is an empty range; lo must be "
           "below hi"},
      {"override TI range misses", WithOverride("{ti_pct: [12, 16], min_records: 1}"),
       "plan.yaml:11:18: " + kOverride +
           ".ti_pct: [12, 16] covers no bin; the bins run "
           "from 0 to 12 %"},
      {"override sets nothing", WithOverride("{wind_ms: [4, 5]}"),
       "plan.yaml:11:9: " + kOverride +
           ": sets nothing; give min_records, optional, channels or several of them"},
      {"override unknown field", WithOverride("{wind_ms: [4, 5], required: 3}"),
       "plan.yaml:11:27: " + kOverride +
           ".required: unknown field; valid fields: wind_ms, "
           "ti_pct, min_records, optional, channels"},
      {"override optional not boolean",
       WithOverride("{wind_ms: [4, 5], optional: maybe}"),
       "plan.yaml:11:37: " + kOverride +
           ".optional: expected true or false, got 'maybe'"},
      {"overrides as a mapping", kBase + "    overrides: {wind_ms: [4, 5]}\n",
       "plan.yaml:10:16: capture_matrix.production.overrides: expected a list, got a "
       "mapping"},
      {"override TI on a state without TI bins",
       kBase + kParked + "    overrides: [{ti_pct: [0, 8], min_records: 1}]\n",
       "plan.yaml:13:26: capture_matrix.parked.overrides[0].ti_pct: this state has no TI "
       "bins (ti_bins_pct is not given); leave ti_pct out"},
      {"every cell optional", kBase + "    overrides: [{optional: true}]\n",
       "plan.yaml:6:3: capture_matrix: has no required cell: every cell is optional or "
       "has "
       "min_records 0; at least one cell must hold up completion"},
      {"every cell removed", Replace(kBase, "min_records: 10", "min_records: 0"),
       "plan.yaml:6:3: capture_matrix: has no required cell: every cell is optional or "
       "has "
       "min_records 0; at least one cell must hold up completion"},
      {"production below cut-in", WithWind("[1, 2, 3, 4]"),
       "plan.yaml:7:19: " + kWind +
           ": the bin 1-2 m/s lies outside turbine.cut_in_ms to "
           "cut_out_ms (3-25 m/s), so it could never fill; remove it or set its "
           "min_records to "
           "0"},
      {"production above cut-out", WithWind("[[24, 25], [25, 26]]"),
       "plan.yaml:7:19: " + kWind +
           ": the bin 25-26 m/s lies outside turbine.cut_in_ms to "
           "cut_out_ms (3-25 m/s), so it could never fill; remove it or set its "
           "min_records to "
           "0"},
  };
}

TEST(CaptureMatrixReaderTest, RejectsBadInputWithExactMessages) {
  for (const BadMatrix& c : BadMatrices()) {
    SCOPED_TRACE(c.name);
    EXPECT_EQ(MatrixError(c.text), c.message);
  }
}

}  // namespace
}  // namespace planner
