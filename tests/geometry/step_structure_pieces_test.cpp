// The exchange-structure check reads its text in pieces of any size (read_step feeds 64 KiB blocks) and
// skips through the long runs of a piece that change nothing but its counters (string text, the rest of
// a token, blanks). Fed one character at a time it takes none of those shortcuts, so that is the
// reference here: whole texts, pieces of every size and hostile variants must give the same findings
// and the same refusal, word for word. Consistency tests: no published value is involved.

#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_structure.hpp"

#include <catch2/catch.hpp>

#include <algorithm>
#include <filesystem>
#include <fstream>
#include <random>
#include <sstream>
#include <string>
#include <string_view>
#include <vector>

namespace sg = stepframe::geometry;

namespace {

// Everything the check reports about a text, as one comparable string.
std::string findings(std::string_view text, std::size_t piece, std::size_t long_list) {
  std::ostringstream out;
  try {
    sg::StepStructureCheck check("<text>", long_list);
    for (std::size_t at = 0; at < text.size(); at += piece) check.feed(text.substr(at, piece));
    check.finish();
    out << "entities " << check.entities() << " doubled quotes " << check.doubled_quotes() << '\n';
    for (const auto& s : check.long_strings())
      out << "long string #" << s.entity << " line " << s.line << " length " << s.length << '\n';
    for (const auto& l : check.long_lists()) {
      out << "long list #" << l.entity << ' ' << l.type << " parameter " << l.parameter << " at " << l.begin << '-'
          << l.end << ':';
      for (auto id : l.items) out << ' ' << id;
      out << '\n';
    }
  } catch (const sg::StepReadError& e) {
    out << "refused: " << e.what() << '\n';
  }
  return out.str();
}

// The test files' texts, in name order (so that the damaged variants below are the same on every machine).
std::vector<std::string> test_files() {
  const std::filesystem::path data = STEPFRAME_TEST_DATA;
  std::vector<std::filesystem::path> files;
  for (const auto& folder : {data, data / "fuzz"})
    for (const auto& entry : std::filesystem::directory_iterator(folder))
      if (entry.path().extension() == ".stp") files.push_back(entry.path());
  std::sort(files.begin(), files.end());
  std::vector<std::string> texts;
  for (const auto& file : files) {
    std::ifstream in(file, std::ios::binary);
    texts.emplace_back(std::istreambuf_iterator<char>(in), std::istreambuf_iterator<char>());
  }
  return texts;
}

}  // namespace

TEST_CASE("the structure check finds the same whatever the pieces, on the test files", "[geometry][step]") {
  const auto texts = test_files();
  REQUIRE(texts.size() >= 20);
  for (const std::string& text : texts) {
    const std::string reference = findings(text, 1, 3);
    for (std::size_t piece : {std::size_t(2), std::size_t(7), std::size_t(64), std::size_t(4096), text.size() + 1})
      CHECK(findings(text, piece, 3) == reference);
  }
}

TEST_CASE("the structure check finds the same whatever the pieces, on damaged texts", "[geometry][step]") {
  // Each test file with bytes changed or put in at random places: blanks, quotes, control characters,
  // line breaks, token characters, a run past OCCT's token length. Most such texts are refused; the
  // refusal must name the same place and reason either way.
  const auto texts = test_files();
  std::mt19937 random(20261205);
  const std::string alphabet = " \t\r\n''\"(),;=#$*/.-+0123456789EAZ_az!\x01\x7f\xc3";
  std::size_t refused = 0, variants = 0;
  for (const std::string& original : texts)
    for (int v = 0; v < 25; ++v) {
      std::string text = original;
      for (int edits = 1 + static_cast<int>(random() % 3); edits > 0 && !text.empty(); --edits) {
        const std::size_t at = random() % text.size();
        // A run of token characters as long as OCCT takes, one more, or two more.
        if (random() % 8 == 0) text.insert(at, std::string(sg::max_step_token + random() % 3, 'A'));
        else if (random() % 2 == 0) text[at] = alphabet[random() % alphabet.size()];
        else text.insert(at, 1, alphabet[random() % alphabet.size()]);
      }
      const std::string reference = findings(text, 1, 3);
      refused += reference.rfind("refused", 0) == 0;
      ++variants;
      for (std::size_t piece : {std::size_t(3), std::size_t(100), text.size()})
        CHECK(findings(text, piece, 3) == reference);
    }
  // Both outcomes were exercised.
  CHECK(refused > variants / 4);
  CHECK(refused < variants);
}
