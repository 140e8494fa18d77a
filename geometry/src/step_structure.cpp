#include "stepframe/geometry/step_structure.hpp"

#include "stepframe/geometry/step_reader.hpp"

#include <spdlog/fmt/fmt.h>

#include <algorithm>
#include <cctype>
#include <cmath>
#include <cstdlib>
#include <limits>
#include <utility>

namespace stepframe::geometry {
namespace {

constexpr const char* damaged =
    "the file is damaged or was not written by a STEP (ISO 10303-21) exporter; export the model again";

// ASCII letters and digits, as OCCT's lexer reads them whatever the host's locale.
bool token_char(char c) {
  return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '_' || c == '#' ||
         c == '.' || c == '+' || c == '-' || c == '!';
}

// A character for a message: named by its code when not printable ASCII, so
// that the message stays valid UTF-8 (results.json, the C ABI).
std::string printable(char c) {
  const auto u = static_cast<unsigned char>(c);
  return std::isprint(u) != 0 && u < 0x80 ? fmt::format("the character '{}'", c)
                                          : fmt::format("the byte 0x{:02X}", static_cast<unsigned>(u));
}

bool digit(char c) { return std::isdigit(static_cast<unsigned char>(c)) != 0; }

// ISO 10303-21 (2016) 6.4.2-6.4.3: INTEGER = [sign] digit {digit}; REAL = [sign] digit {digit} "."
// {digit} ["E" [sign] digit {digit}]. Anything else OCCT's lexer splits or misreads ("5000..0." became
// a point that its transfer dereferenced as null: a fuzz finding).
bool number_syntax(std::string_view t) {
  std::size_t i = t[0] == '+' || t[0] == '-' ? 1 : 0;
  const auto digits = [&] {
    const std::size_t from = i;
    while (i < t.size() && digit(t[i])) ++i;
    return i > from;
  };
  if (!digits()) return false;
  if (i == t.size()) return true;
  if (t[i++] != '.') return false;
  digits();
  if (i == t.size()) return true;
  if (t[i++] != 'E') return false;
  if (i < t.size() && (t[i] == '+' || t[i] == '-')) ++i;
  return digits() && i == t.size();
}

// ISO 10303-21 6.4.6: ENUMERATION = "." UPPER {UPPER | DIGIT} "." (UPPER includes _), as OCCT's lexer reads it.
bool enumeration_syntax(std::string_view t) {
  return t.size() >= 3 && t.front() == '.' && t.back() == '.' &&
         std::all_of(t.begin() + 1, t.end() - 1, [](char c) {
           return (c >= 'A' && c <= 'Z') || digit(c) || c == '_';
         });
}

bool control(char c) {
  const auto u = static_cast<unsigned char>(c);
  return (u < 0x20 && c != '\n' && c != '\r' && c != '\t') || u == 0x7f;
}

}  // namespace

bool empty_list_allowed(std::string_view entity_type) {
  // Entities of presentation and product data that exporters write with an
  // empty list, each tried with OCCT 7.6 (Debian 12) reading it safely.
  static constexpr std::string_view allowed[] = {
      "DRAUGHTING_MODEL", "MECHANICAL_DESIGN_GEOMETRIC_PRESENTATION_REPRESENTATION", "PRESENTATION_LAYER_ASSIGNMENT",
      "PRESENTATION_STYLE_ASSIGNMENT", "PRODUCT", "PRODUCT_RELATED_PRODUCT_CATEGORY", "SHAPE_REPRESENTATION",
      "STYLED_ITEM"};
  return std::find(std::begin(allowed), std::end(allowed), entity_type) != std::end(allowed);
}

StepStructureCheck::StepStructureCheck(std::string source, std::size_t long_list)
    : source_(std::move(source)), long_list_(long_list), owner_(1) {}

std::string StepStructureCheck::here() const {
  return current_ != 0 ? fmt::format("#{} (line {})", current_, line_) : fmt::format("line {}", line_);
}

void StepStructureCheck::fail(const std::string& what) const {
  throw StepReadError(fmt::format("{}: {}", source_, what));
}

void StepStructureCheck::fail_bare_word() const {
  fail(fmt::format("{}: '{}' stands where a value belongs; STEP values are finite numbers such as 1.5E3, strings, "
                   "references (#12) or enumerations (.T.); {}",
                   here(), word_, damaged));
}

void StepStructureCheck::fail_form(const std::string& what) const {
  fail(fmt::format("{}: {}; an entity instance is written #12 = KEYWORD(...); or #12 = (A(...) B(...)); "
                   "(ISO 10303-21 12.2); {}",
                   here(), what, damaged));
}

void StepStructureCheck::feed(std::string_view piece) {
  const char* p = piece.data();
  const char* const end = p + piece.size();
  while (p < end) {
    character(*p++);
    // The long runs that change nothing but counters go past in a tight loop, each stopping before the
    // first character character() would treat otherwise: the rest of a string's text, the rest of a
    // keyword, number or reference (up to OCCT's token length, whose excess character() reports), and
    // blanks between tokens. The state after a run is what one character() call per character leaves.
    const char* q = p;
    if (mode_ == Mode::string && !quote_) {
      std::size_t lines = 0;
      while (q < end && *q != '\'' && !control(*q)) lines += *q++ == '\n';
      line_ += lines;
      run_ += static_cast<std::size_t>(q - p);
    } else if (mode_ == Mode::normal && !slash_ && !token_.empty()) {
      while (q < end && token_char(*q) && token_.size() + static_cast<std::size_t>(q - p) < max_step_token) ++q;
      token_.append(p, q);
    } else if (mode_ == Mode::normal && !slash_ && (p[-1] == ' ' || p[-1] == '\n' || p[-1] == '\r' || p[-1] == '\t')) {
      std::size_t lines = 0;
      while (q < end && (*q == ' ' || *q == '\n' || *q == '\r' || *q == '\t')) lines += *q++ == '\n';
      line_ += lines;
    }
    offset_ += static_cast<std::size_t>(q - p);
    p = q;
  }
}

void StepStructureCheck::character(char c) {
  const std::size_t at = offset_++;
  if (c == '\n') ++line_;
  if (control(c))
    fail(fmt::format("{}: the text holds a control character (byte 0x{:02X}); STEP files are plain text; {}", here(),
                     static_cast<unsigned>(static_cast<unsigned char>(c)), damaged));
  switch (mode_) {
    case Mode::comment:
      if (star_ && c == '/') mode_ = Mode::normal;
      star_ = c == '*';
      run_ = c == '*' || c == '\n' ? 0 : run_ + 1;  // OCCT reads comment text between stars and line breaks
      if (run_ > max_step_token)
        fail(fmt::format("{}: a comment holds more than {} characters without a line break, more than OCCT's "
                         "reader takes; {}",
                         here(), max_step_token, damaged));
      return;
    case Mode::binary:
      if (c == '"') {
        mode_ = Mode::normal;
        value_done_ = true;
        return;
      }
      // ISO 10303-21 5.3: a binary value is '"', a digit 0-3, hexadecimal digits, '"'. Anything else means
      // the quote was stray, and OCCT's lexer and this check would see different entities in what follows.
      if (std::isxdigit(static_cast<unsigned char>(c)) == 0 || std::islower(static_cast<unsigned char>(c)) != 0)
        fail(fmt::format("{}: a binary value (after '\"', line {}) holds {}, not a hexadecimal digit (0-9, A-F); {}",
                         here(), run_line_, printable(c), damaged));
      if (++run_ > max_step_token)
        fail(fmt::format("{}: a binary value longer than {} characters, more than OCCT's reader takes; {}", here(),
                         max_step_token, damaged));
      return;
    case Mode::string:
      if (!quote_) {
        quote_ = c == '\'';
        if (!quote_) ++run_;
        return;
      }
      quote_ = false;
      if (c == '\'') {  // '' is a quote inside the string
        doubled_quotes_ = true;
        run_ += 5;       // the reader gives OCCT \X\27 for it
        return;
      }
      mode_ = Mode::normal;   // the quote before ended the string: c is the next character
      value_done_ = true;
      if (run_ > max_step_token) long_strings_.push_back({current_, run_line_, run_});
      break;
    case Mode::normal:
      break;
  }
  if (slash_) {
    slash_ = false;
    if (c == '*') {
      mode_ = Mode::comment;
      star_ = false;
      run_ = 0;
      return;
    }
  }
  if (token_char(c)) {
    if (token_.empty() && !word_.empty())
      fail_bare_word();
    if (token_.empty()) value_starts(depth_);
    token_ += c;
    if (token_.size() > max_step_token)
      fail(fmt::format("{}: a keyword, number or reference of more than {} characters ('{}...'), more than OCCT's "
                       "reader takes; {}",
                       here(), max_step_token, token_.substr(0, 24), damaged));
    empty_list_ = false;
    return;
  }
  end_token();
  if (c == '/') {
    slash_ = true;
    return;
  }
  if (std::isspace(static_cast<unsigned char>(c)) != 0) return;
  if (!word_.empty()) {
    if (c != '(')
      fail_bare_word();
    word_.clear();
  }
  const bool typed = std::exchange(after_keyword_, false);  // '(' after a keyword opens its parameters
  const bool was_empty = std::exchange(empty_list_, false);
  switch (c) {
    case '(': {
      if (depth_ == 0 && current_ != 0) {
        if (form_ != Form::equals && form_ != Form::typed) fail_form("a '(' after the entity's parameters");
        form_ = Form::open;
      }
      if (++depth_ > max_step_nesting)
        fail(fmt::format("{}: parentheses nest more than {} levels deep; {}", here(), max_step_nesting, damaged));
      const auto d = static_cast<std::size_t>(depth_);
      if (owner_.size() <= d) owner_.resize(d + 1);
      if (!typed) value_starts(depth_ - 1);  // a list as a value (a typed value's own list began with its keyword)
      owner_[d] = typed ? keyword_ : owner_[d - 1];  // a list belongs to the entity or value it stands in
      // "#20 = ( A() B() )": a complex instance's records, one after another without commas (ISO 10303-21 12.2.5.2).
      records_.resize(owner_.size());
      records_[d] = !typed && d == 1;
      if (d == 1) parameter_ = 0;
      list_plain_ = list_plain_ && d != 3;  // a list or typed value inside the list
      if (d == 2 && !typed && !records_[1] && current_ != 0) {
        list_open_ = list_plain_ = true;
        list_begin_ = at;
        list_commas_ = 0;
        list_first_ref_ = refs_.size();
      }
      empty_list_ = !typed;
      value_done_ = false;
      break;
    }
    case ')': {
      const std::string& owner = owner_[static_cast<std::size_t>(std::max(depth_, 0))];
      if (was_empty && current_ != 0 && !empty_list_allowed(owner))
        fail(fmt::format("{}: an empty list '()' in {}; the STEP schemas want at least one item in this list and "
                         "OCCT's reader cannot take an empty one; {}",
                         here(), owner.empty() ? "the entity" : owner, damaged));
      if (expect_value_) fail(fmt::format("{}: a ',' just before ')' (a parameter is missing); {}", here(), damaged));
      if (depth_ == 2 && std::exchange(list_open_, false)) note_list(at);
      if (--depth_ < 0) fail(fmt::format("{}: a ')' closes no '('; {}", here(), damaged));
      if (depth_ == 0) form_ = Form::closed;
      value_done_ = depth_ > 0;
      break;
    }
    case ';':
      if (depth_ != 0)
        fail(fmt::format("{}: the entity's parameter list is not closed before ';' ({} '(' open); {}", here(), depth_,
                         damaged));
      if (current_ != 0 && form_ != Form::closed) fail_form("a ';' before the entity's parameters");
      current_ = 0;
      value_done_ = expect_value_ = false;
      break;
    case '\'':
      if (depth_ == 0) fail_form("a string outside any parameter list");
      value_starts(depth_);
      mode_ = Mode::string;
      quote_ = false;
      run_ = 0;
      run_line_ = line_;
      break;
    case '"':
      if (depth_ == 0) fail_form("a binary value outside any parameter list");
      value_starts(depth_);
      mode_ = Mode::binary;
      run_ = 0;
      run_line_ = line_;
      break;
    case ',':
      if (depth_ == 0) fail_form("a ',' outside any parameter list");
      if (!value_done_)
        fail(fmt::format("{}: a ',' where a parameter belongs (two commas, or a comma just after '('); {}", here(),
                         damaged));
      value_done_ = false;
      expect_value_ = true;
      if (depth_ == 1) ++parameter_;
      if (depth_ == 2) ++list_commas_;
      break;
    case '$':  // an unset value
    case '*':  // a value derived from others
      if (depth_ == 0) fail_form(fmt::format("a '{}' outside any parameter list", c));
      value_starts(depth_);
      value_done_ = depth_ > 0;
      break;
    case '=':
      if (current_ == 0 || depth_ != 0 || form_ != Form::named) fail_form("an '=' after anything but #12");
      form_ = Form::equals;
      break;
    default:  // ISO 10303-21 5.3 writes nothing else outside strings, comments and binaries
      fail(fmt::format("{}: {} cannot stand there (outside a string); {}", here(), printable(c), damaged));
  }
}

// A list at depth 2 ends at `end`: noted when it holds nothing but long_list_ or more references.
void StepStructureCheck::note_list(std::size_t end) {
  const std::size_t refs = refs_.size() - list_first_ref_;
  if (!list_plain_ || refs < long_list_ || refs != list_commas_ + 1) return;
  long_lists_.push_back({current_, owner_[1], parameter_, list_begin_, end,
                         std::vector<std::uint64_t>(refs_.begin() + static_cast<std::ptrdiff_t>(list_first_ref_),
                                                    refs_.end())});
}

void StepStructureCheck::value_starts(int depth) {
  expect_value_ = false;
  if (depth == 0 || (depth == 1 && records_.size() > 1 && records_[1])) return;
  if (value_done_)
    fail(fmt::format("{}: two parameters follow each other without a ',' between them; {}", here(), damaged));
}

void StepStructureCheck::end_token() {
  if (token_.empty()) return;
  std::string t;
  t.swap(token_);
  after_keyword_ = false;
  const char first = t.front();
  if (first == '#') {
    if (t.size() < 2 || !std::all_of(t.begin() + 1, t.end(), digit) || t.size() > 19)
      fail(fmt::format("{}: '{}' is not an entity reference (# and a number); {}", here(), t, damaged));
    std::uint64_t id = 0;  // at most 18 digits (checked above): no overflow
    for (auto c = t.begin() + 1; c != t.end(); ++c) id = 10 * id + static_cast<std::uint64_t>(*c - '0');
    if (depth_ == 0) {  // an entity instance begins: #12 = ...
      if (current_ != 0) fail_form(fmt::format("{} begins before a ';' ends #{}", t, current_));
      current_ = id;
      form_ = Form::named;
      ids_.push_back(id);
      lines_.push_back(static_cast<std::uint32_t>(std::min<std::size_t>(line_, std::numeric_limits<std::uint32_t>::max())));
      first_ref_.push_back(refs_.size());
    } else {
      if (current_ == 0) fail(fmt::format("{}: a reference {} stands outside any entity; {}", here(), t, damaged));
      refs_.push_back(id);
      value_done_ = true;
    }
    return;
  }
  if (digit(first) || first == '+' || first == '-') {
    if (!number_syntax(t))
      fail(fmt::format("{}: '{}' is not a number as ISO 10303-21 writes one (digits, a point, more digits and an "
                       "exponent after a capital E, such as -1.5E+03), and OCCT's reader would take it for something "
                       "else; {}",
                       here(), t, damaged));
    if (depth_ == 0 && current_ != 0) fail_form(fmt::format("the number {} outside any parameter list", t));
    value_done_ = depth_ > 0;
    // A real below 10^300 (no exponent, at most 300 digits before the point) is finite for sure; only
    // the others are converted to see whether they are.
    const std::size_t point = t.find('.');
    const std::size_t integer_digits = point == std::string::npos ? 0 : point - (digit(first) ? 0 : 1);
    if (point != std::string::npos && (t.find('E') != std::string::npos || integer_digits > 300)) {
      const double value = std::strtod(t.c_str(), nullptr);
      if (!std::isfinite(value))
        fail(fmt::format("{}: the number {} is beyond the range of numbers (about 1.8E308); a coordinate or "
                         "value of the model is corrupt; {}",
                         here(), t, damaged));
    }
    return;
  }
  if (first == '.') {
    if (!enumeration_syntax(t))
      fail(fmt::format("{}: '{}' is neither a number nor an enumeration (capital letters, digits or _ between two "
                       "points, such as .T. or .MILLI.); {}",
                       here(), t, damaged));
    if (depth_ == 0 && current_ != 0) fail_form(fmt::format("the enumeration {} outside any parameter list", t));
    value_done_ = depth_ > 0;
    return;
  }
  if (std::isalpha(static_cast<unsigned char>(first)) != 0 || first == '!' || first == '_') {
    // Inside an entity only: the file's first and last lines are ISO-10303-21; and END-ISO-10303-21;
    if (current_ != 0 &&
        std::any_of(t.begin() + 1, t.end(), [](char c) { return c == '.' || c == '+' || c == '-' || c == '#'; }))
      fail(fmt::format("{}: '{}' is not a keyword (letters, digits and _ only); {}", here(), t, damaged));
    if (depth_ > 0) word_ = t;  // a keyword inside parameters must be followed by '(' (a typed value)
    if (depth_ == 0 && current_ != 0) {
      if (form_ != Form::equals) fail_form(fmt::format("the keyword '{}' stands where it does not belong", t));
      form_ = Form::typed;
    }
    keyword_ = std::move(t);
    after_keyword_ = true;
  }
}

void StepStructureCheck::finish() {
  end_token();
  if (!word_.empty())
    fail(fmt::format("{}: the text ends after '{}'; {}", here(), word_, damaged));
  if (mode_ == Mode::string && !quote_)
    fail(fmt::format("{}: the text ends inside a quoted string (a closing quote is missing); {}", here(), damaged));
  if (mode_ == Mode::binary)
    fail(fmt::format("{}: the text ends inside a binary value (the '\"' on line {} is not closed); {}", here(),
                     run_line_, damaged));
  if (mode_ == Mode::comment) fail(fmt::format("{}: the text ends inside a comment (/* without */); {}", here(), damaged));
  if (depth_ != 0) fail(fmt::format("{}: the text ends with {} '(' open; {}", here(), depth_, damaged));
  if (current_ != 0) fail_form(fmt::format("the text ends before a ';' ends #{}", current_));

  const std::size_t n = ids_.size();
  first_ref_.push_back(refs_.size());
  // Entity id -> position in file order, by binary search over the sorted ids.
  std::vector<std::pair<std::uint64_t, std::uint32_t>> by_id(n);
  for (std::size_t k = 0; k < n; ++k) by_id[k] = {ids_[k], static_cast<std::uint32_t>(k)};
  std::sort(by_id.begin(), by_id.end());
  for (std::size_t k = 1; k < n; ++k)
    if (by_id[k].first == by_id[k - 1].first)
      fail(fmt::format("#{} is defined twice (lines {} and {}); {}", by_id[k].first, lines_[by_id[k - 1].second],
                       lines_[by_id[k].second], damaged));
  auto index_of = [&](std::uint64_t id) -> std::int64_t {
    const auto it = std::lower_bound(by_id.begin(), by_id.end(), std::make_pair(id, std::uint32_t{0}));
    return it != by_id.end() && it->first == id ? static_cast<std::int64_t>(it->second) : -1;
  };
  std::vector<std::uint32_t> target(refs_.size());
  for (std::size_t k = 0; k < n; ++k)
    for (std::size_t r = first_ref_[k]; r < first_ref_[k + 1]; ++r) {
      const std::int64_t t = index_of(refs_[r]);
      if (t < 0)
        fail(fmt::format("#{} (line {}) refers to #{}, which the file does not define; {}", ids_[k], lines_[k],
                         refs_[r], damaged));
      target[r] = static_cast<std::uint32_t>(t);
    }

  // Cycles: a depth-first walk without recursion (white 0, on the path 1, done 2).
  std::vector<std::uint8_t> state(n, 0);
  std::vector<std::uint32_t> chain(n, 0);  // the longest chain of references from each entity
  std::vector<std::pair<std::uint32_t, std::size_t>> path;  // entity, next reference to follow
  for (std::size_t start = 0; start < n; ++start) {
    if (state[start] != 0) continue;
    path.push_back({static_cast<std::uint32_t>(start), first_ref_[start]});
    state[start] = 1;
    while (!path.empty()) {
      auto& [k, next] = path.back();
      if (next == first_ref_[k + 1]) {  // every reference of k is done: its chain length is known
        state[k] = 2;
        for (std::size_t r = first_ref_[k]; r < first_ref_[k + 1]; ++r)
          chain[k] = std::max(chain[k], chain[target[r]] + 1);
        if (chain[k] > max_step_reference_depth) fail_deep_chain(k, chain, target);
        path.pop_back();
        continue;
      }
      const std::uint32_t t = target[next++];
      if (state[t] == 1) {
        if (t == k)
          fail(fmt::format("#{} (line {}) refers to itself; an entity cannot contain itself; {}", ids_[k], lines_[k],
                           damaged));
        std::string loop;
        bool on = false;
        for (const auto& step : path) {
          on = on || step.first == t;
          if (on) loop += fmt::format("#{} -> ", ids_[step.first]);
        }
        fail(fmt::format("#{} (line {}) refers back to itself through {}#{}; an entity cannot contain itself; {}",
                         ids_[t], lines_[t], loop, ids_[t], damaged));
      }
      if (state[t] == 0) {
        state[t] = 1;
        path.push_back({t, first_ref_[t]});
      }
    }
  }
}

void StepStructureCheck::fail_deep_chain(std::size_t k, const std::vector<std::uint32_t>& chain,
                                         const std::vector<std::uint32_t>& target) const {
  std::string start;  // the first links of the longest chain
  for (std::size_t at = k, shown = 0; shown < 4; ++shown) {
    start += fmt::format("#{} -> ", ids_[at]);
    std::size_t longest = at;
    for (std::size_t r = first_ref_[at]; r < first_ref_[at + 1]; ++r)
      if (chain[target[r]] + 1 == chain[at]) longest = target[r];
    if (longest == at) break;
    at = longest;
  }
  fail(fmt::format("#{} (line {}) begins a chain of more than {} references ({}...); OCCT follows such chains by "
                   "recursion and would overflow its stack; {}",
                   ids_[k], lines_[k], max_step_reference_depth, start, damaged));
}

StepRewrites check_step_structure(std::string_view text, const std::string& source, std::size_t long_list) {
  StepStructureCheck check(source, long_list);
  check.feed(text);
  check.finish();
  return {check.long_strings(), check.long_lists()};
}

}  // namespace stepframe::geometry
