// Project text held in memory (the C ABI's and the API's text entry points)
// passes the same checks as a project file before its YAML is read.

#include "stepframe/errors.hpp"
#include "stepframe/project_reader.hpp"

#include <catch2/catch.hpp>

#include <string>

using Catch::Matchers::Contains;

namespace {

const std::string valid =
    "model: beam.stp\n"
    "cases:\n  - name: G\n    self_weight: true\n";

std::string refusal(const std::string& text) {
  try {
    (void)stepframe::read_project_text(text, "/base", "<text>");
  } catch (const stepframe::InputError& e) {
    return e.what();
  }
  return "(accepted)";
}

}  // namespace

TEST_CASE("project text: duplicate keys, list keys, bad UTF-8 and too many cases are refused with the line") {
  CHECK_NOTHROW(stepframe::read_project_text(valid, "/base", "<text>"));
  CHECK_THAT(refusal(valid + "model: other.stp\n"),
             Contains("<text>:5") && Contains("'model' appears a second time") && Contains("first on line 1"));
  CHECK_THAT(refusal(valid + "? {a: 1}\n: 2\n"), Contains("<text>:5") && Contains("a key must be a plain name"));
  CHECK_THAT(refusal("model: beam.stp # \xC3\x28\n" + valid.substr(16)),
             Contains("<text>:1") && Contains("0xC3") && Contains("not UTF-8"));
  CHECK_THAT(refusal("model: beam.stp\ncases:\n  - name: \xED\xA0\x80\n"), Contains("<text>:3"));  // a surrogate
  CHECK(refusal("model: beam.stp\ncases:\n  - name: caf\xC3\xA9\n") == "(accepted)");        // UTF-8 é is fine
  std::string many = "model: beam.stp\ncases:\n";
  for (int i = 0; i <= 10000; ++i) many += "  - {name: C" + std::to_string(i) + "}\n";
  CHECK_THAT(refusal(many), Contains("10001 load cases, more than the 10000"));
  // Aliases used over and over expand the tree exponentially: bounded, not walked for ever.
  std::string laughs = "a0: &a0 [x, x, x, x, x, x, x, x, x, x]\n";
  for (int i = 1; i < 12; ++i)
    laughs += "a" + std::to_string(i) + ": &a" + std::to_string(i) + " [*a" + std::to_string(i - 1) + ", *a" +
              std::to_string(i - 1) + ", *a" + std::to_string(i - 1) + ", *a" + std::to_string(i - 1) + "]\n";
  CHECK_THAT(refusal(laughs + valid), Contains("more than four million values"));
}
