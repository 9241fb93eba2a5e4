// A quote that does not close on its line is reported where it opens
// (io/yaml_quotes.h). YAML itself (YAML 1.2, sections 7.3.1 and 7.3.2) lets
// quoted scalars run over lines, which is what makes a forgotten quote
// swallow the lines below it.
#include "io/yaml_quotes.h"

#include <gtest/gtest.h>

#include <string>

#include "planner/error.h"

namespace planner {
namespace io {
namespace {

std::string ErrorOf(const std::string& text) {
  try {
    CheckQuotesClose(text, "plan.yaml");
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

const std::string kTail =
    " that opens this value is not closed on this line; close it with ";

TEST(YamlQuotesTest, UnterminatedQuoteIsReportedWhereItOpens) {
  const struct {
    const char* name;
    std::string text;
    std::string error;
  } cases[] = {
      {"double, top level", "name: \"Ridge\ncampaign:\n  start: 2027-03-01\n",
       "plan.yaml:1:7: unterminated quote: the \"" + kTail + "\""},
      {"single, nested", "turbine:\n  name: 'QT-150\n  cut_in_ms: 3\n",
       "plan.yaml:2:9: unterminated quote: the '" + kTail + "'"},
      {"list item", "names:\n  - \"a\"\n  - \"b\n", "plan.yaml:3:5: unterminated quote"},
      {"in a flow list", "sectors: [\"a\", 'b]\n", "plan.yaml:1:16: unterminated quote"},
      {"in a flow mapping", "- {frequency: 0.5, note: \"x}\n",
       "plan.yaml:1:26: unterminated quote"},
      {"escaped closing quote", "name: \"a\\\"\n", "plan.yaml:1:7: unterminated quote"},
      {"after a CR LF line", "a: 1\r\nname: 'x\r\n", "plan.yaml:2:7: unterminated quote"},
  };
  for (const auto& c : cases) {
    SCOPED_TRACE(c.name);
    EXPECT_EQ(ErrorOf(c.text).substr(0, c.error.size()), c.error);
  }
}

TEST(YamlQuotesTest, ClosedQuotesAndQuotesInTextPass) {
  const char* const cases[] = {
      "name: \"QT-150 at the ridge\"\n",
      "name: 'it''s closed'\n",
      "name: \"say \\\"hi\\\"\"   # a comment\n",
      "name: O'Brien's ridge\n",             // a quote inside plain text
      "note: 5\" rain gauge\n",              // likewise
      "a: 1  # the site's \"best\" mast\n",  // quotes in a comment
      "# 'an unclosed quote in a comment\n",
      "sectors: [{a: 'x', b: \"y\"}, 'z']\n",
      "nested:\n  - [1, 2]\n  - {k: 'v'}\n",
      "text: |\n  a block with a ' quote\n  and \" another\nnext: 'ok'\n",
      "text: >-\n  folded ' text\nnext: 1\n",
      "",
  };
  for (const char* text : cases) EXPECT_EQ(ErrorOf(text), "") << text;
}

}  // namespace
}  // namespace io
}  // namespace planner
