// The seal that tells fillcast's own output files from a user's files
// (io/file_seal.h).
#include "io/file_seal.h"

#include <gtest/gtest.h>

#include <string>

namespace planner {
namespace {

// FNV-1a 64-bit test vectors of the FNV reference code (Fowler, Noll, Vo;
// from memory, and re-derived by hand from the published offset basis and
// prime).
TEST(FileSealTest, HashMatchesPublishedFnv1aVectors) {
  EXPECT_EQ(Fnv1a64(""), 0xcbf29ce484222325ULL);
  EXPECT_EQ(Fnv1a64("a"), 0xaf63dc4c8601ec8cULL);
  EXPECT_EQ(Fnv1a64("foobar"), 0x85944171f73967e8ULL);
}

TEST(FileSealTest, SealedTextPassesAndAnyEditFails) {
  const std::string text = std::string("{\"tool\": {\"seal\": \"") + kSealPlaceholder +
                           "\"}, \"runs\": 2000}\n";
  const std::string sealed = SealContents(text);
  ASSERT_NE(sealed, text);
  EXPECT_EQ(sealed.size(), text.size());
  EXPECT_TRUE(HasValidSeal(sealed));
  for (std::size_t i = 0; i < sealed.size(); i += 7) {
    std::string edited = sealed;
    edited[i] = edited[i] == 'x' ? 'y' : 'x';
    EXPECT_FALSE(HasValidSeal(edited)) << "edit at " << i;
  }
  EXPECT_FALSE(HasValidSeal(sealed + "my note\n"));
}

TEST(FileSealTest, TextThatOnlyMentionsTheMarksIsNotSealed) {
  const std::string cases[] = {
      "",
      "my notes: \"name\": \"fillcast\" and generator=fillcast",
      std::string("copied from the docs: ") + kSealPlaceholder + "\n",
      "fillcast-seal:0123456789abcdef\n",
      "fillcast-seal:0123",
      "fillcast-seal:XYZ",
  };
  for (const std::string& text : cases) EXPECT_FALSE(HasValidSeal(text)) << text;
}

TEST(FileSealTest, TheLastSealCounts) {
  // A user's text holding a placeholder before the writer's own one.
  const std::string text =
      std::string("name: ") + kSealPlaceholder + "\n# " + kSealPlaceholder + "\n";
  const std::string sealed = SealContents(text);
  EXPECT_TRUE(HasValidSeal(sealed));
  EXPECT_EQ(sealed.find(kSealPlaceholder), 6u);  // the first one left as it was
}

TEST(FileSealTest, TextWithoutPlaceholderIsLeftAlone) {
  EXPECT_EQ(SealContents("plain text\n"), "plain text\n");
  EXPECT_FALSE(HasValidSeal("plain text\n"));
}

}  // namespace
}  // namespace planner
