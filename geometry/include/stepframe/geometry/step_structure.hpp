#pragma once
// A check of a STEP file's exchange structure (ISO 10303-21) made before OCCT
// parses it: OCCT trusts the structure and can crash on a reference to an
// absent entity, an entity that refers to itself, or parentheses nested
// thousands deep. The check is one pass over the text, fed in pieces of any
// size, and then a walk over the references.

#include <cstddef>
#include <cstdint>
#include <string>
#include <string_view>
#include <vector>

namespace stepframe::geometry {

/// The deepest nesting of parentheses accepted (OCCT's own entities use a
/// handful of levels: lists of lists of points).
inline constexpr int max_step_nesting = 100;

/// The longest chain of references accepted (#1 refers to #2, which refers
/// to #3...). OCCT follows some chains by recursion: a chain of 300,000
/// oriented edges, each the edge of the next, overflows an 8 MiB stack in
/// StepShape_OrientedEdge::EdgeStart (tried with OCCT 7.6.3, Debian 12), and
/// a host's thread may have far less. Exported frames stay within a few
/// dozen levels: an assembly's levels do not chain references (each
/// occurrence refers to its parent and its child definition).
inline constexpr std::size_t max_step_reference_depth = 1000;

/// OCCT 7.6's STEP lexer keeps a token (a quoted string, a keyword, a number,
/// a run of comment text) in a 16 KiB buffer that cannot grow: a token longer
/// than 16382 characters stops its parse with "input buffer overflow"
/// (tried with OCCT 7.6.3, Debian 12). stepframe takes this lower limit, for a
/// margin: longer strings are cut to it before OCCT reads them (with a
/// warning), any other longer token is refused.
inline constexpr std::size_t max_step_token = 16000;

/// A string longer than max_step_token: the entity holding it (0 in the
/// header), the line it starts on and its length in characters as OCCT would
/// read it (a doubled quote counts 5, since it is rewritten as \X\27).
struct StepLongString {
  std::uint64_t entity = 0;
  std::size_t line = 0;
  std::size_t length = 0;
};

/// OCCT 7.6's STEP parser appends each parameter to its list by walking the
/// list from its start (StepFile_ReadData::CreateNewArg), so a list of n items
/// costs n^2 / 2 steps: the 100,000 items of a large frame's
/// SHAPE_REPRESENTATION took some 8 s of a 20 s read (tried with OCCT 7.6.3,
/// Debian 12). Lists of references at least this long are cut before OCCT
/// parses the text and put back whole afterwards (step_long_lists.hpp).
inline constexpr std::size_t long_step_list = 1024;

/// A list of at least long_step_list entity references, standing as a
/// parameter of its own in a simple entity instance (`#32 = SHAPE_REPRESENTATION('',(#11,#33,...),#7);`):
/// where it stands in the text and the ids it lists, in order.
struct StepLongList {
  std::uint64_t entity = 0;
  std::string type;                  ///< the entity's type, e.g. "SHAPE_REPRESENTATION"
  std::size_t parameter = 0;         ///< which of its parameters, from 0
  std::size_t begin = 0, end = 0;    ///< offsets of its '(' and ')' in the text
  std::vector<std::uint64_t> items;  ///< the referenced ids
};

/// Checks, as text arrives, that:
/// - every reference (#12) names an entity the file defines, and no entity is defined twice;
/// - no entity refers to itself, directly or through others (the STEP
///   schemas that stepframe reads allow no such cycle);
/// - no chain of references is longer than max_step_reference_depth;
/// - parentheses nest at most max_step_nesting deep and are balanced;
/// - a binary value ("0F3A") holds hexadecimal digits only and is closed;
/// - every entity instance has the form `#12 = KEYWORD(...);` or, for a
///   complex instance, `#12 = (A(...) B(...));` (ISO 10303-21 12.2, clause
///   number from memory): a stray '=' or ',' in a keyword makes OCCT read
///   another entity than the one written;
/// - parameters are separated by single commas (none missing, none doubled);
/// - numbers, enumerations and keywords have the syntax of ISO 10303-21 6.4;
/// - every number is finite (no 1E400) and no bare word (NAN, INF) stands
///   where a value belongs;
/// - no entity instance holds an empty list `()`: the schemas' lists hold at
///   least one item, and OCCT's reader crashes on an empty one in many
///   entities (EDGE_LOOP, CONNECTED_EDGE_SET, TRIMMED_CURVE, DIRECTION...).
///   A few entities of presentation and product data that exporters do
///   write with an empty list, and that OCCT reads safely, are let through
///   (empty_list_allowed);
/// - the file holds no control characters (a NUL byte inside a keyword
///   makes OCCT read another entity than the one written) other than tab,
///   line feed and carriage return;
/// - no keyword, number, reference, binary value or run of comment text is
///   longer than max_step_token (longer strings are listed in long_strings()).
/// Each failure throws StepReadError naming `source`, the entity (#id) and
/// its line, and what to do. On the way it notes the long lists of references
/// (long_lists()).
class StepStructureCheck {
 public:
  /// `long_list` is the fewest items a list of references needs to be listed in long_lists().
  explicit StepStructureCheck(std::string source, std::size_t long_list = long_step_list);
  /// The next piece of the text (pieces may split tokens anywhere).
  void feed(std::string_view piece);
  /// After the last piece: the references and cycles.
  void finish();

  std::size_t entities() const { return ids_.size(); }
  /// True when a string holds a doubled quote ('O''Neil'), which OCCT's
  /// lexer mis-reads before a comma (the reader rewrites such text).
  bool doubled_quotes() const { return doubled_quotes_; }
  /// The strings that must be cut before OCCT reads them (shorten_long_strings).
  const std::vector<StepLongString>& long_strings() const { return long_strings_; }
  /// The lists of references with at least `long_list` items, in text order.
  const std::vector<StepLongList>& long_lists() const { return long_lists_; }

 private:
  void character(char c);
  void end_token();
  [[noreturn]] void fail(const std::string& what) const;
  [[noreturn]] void fail_bare_word() const;
  [[noreturn]] void fail_form(const std::string& what) const;  // an entity instance not of the form #12 = A(...);
  void value_starts(int depth);  // a parameter begins in a list at `depth`: the one before must be closed by ','
  void note_list(std::size_t end);  // the list of references being read ends at `end`
  [[noreturn]] void fail_deep_chain(std::size_t k, const std::vector<std::uint32_t>& chain,
                                    const std::vector<std::uint32_t>& target) const;
  std::string here() const;

  std::string source_;
  // Lexer state (carried across pieces).
  enum class Mode { normal, comment, string, binary } mode_ = Mode::normal;
  bool slash_ = false;          // a '/' that may open a comment
  bool star_ = false;           // a '*' that may close one
  bool quote_ = false;          // a quote inside a string that may be the first of ''
  bool doubled_quotes_ = false;
  std::size_t run_ = 0;         // length of the string, binary value or comment text being read
  std::size_t run_line_ = 0;    // the line it starts on
  std::vector<StepLongString> long_strings_;
  // The list of references being read as a parameter of the entity (at depth 2), if it may be a long one.
  std::size_t long_list_ = 0;
  std::vector<StepLongList> long_lists_;
  std::size_t offset_ = 0;      // of the character being read, from the start of the text
  std::size_t parameter_ = 0;   // of the entity's parameters (depth 1), the one being read
  bool list_open_ = false;      // a list at depth 2 is being read...
  bool list_plain_ = false;     // ... holding no list or typed value of its own
  std::size_t list_begin_ = 0, list_commas_ = 0, list_first_ref_ = 0;
  std::string token_;
  std::string word_;            // a keyword waiting to see whether '(' follows
  int depth_ = 0;
  std::vector<std::string> owner_;  // per depth: the entity type or typed value whose parameters are open
  bool empty_list_ = false;     // a list '(' opened and nothing seen in it yet
  std::vector<char> records_;   // per depth: the list is a complex instance's records (no commas)
  bool value_done_ = false;     // a parameter is complete: ',' or ')' must come next
  bool expect_value_ = false;   // a ',' was read: a parameter must come next
  std::string keyword_;         // the last keyword read
  bool after_keyword_ = false;  // nothing but blanks since it
  std::size_t line_ = 1;
  // The entity being read.
  std::uint64_t current_ = 0;   // its id, 0 between entities
  // How far its form `#12 = KEYWORD(...);` has come: `#12`, `=`, the keyword, '(' and its ')'.
  enum class Form { named, equals, typed, open, closed } form_ = Form::closed;
  // The entities in file order, their lines and references (CSR: refs_[first_ref_[k]...]).
  std::vector<std::uint64_t> ids_;
  std::vector<std::uint32_t> lines_;
  std::vector<std::size_t> first_ref_;
  std::vector<std::uint64_t> refs_;
};

/// True for the entity types whose lists may be empty (see StepStructureCheck).
bool empty_list_allowed(std::string_view entity_type);

/// What StepStructureCheck found to rewrite in a text it let through.
struct StepRewrites {
  std::vector<StepLongString> long_strings;
  std::vector<StepLongList> long_lists;
};

/// Runs StepStructureCheck over the whole text.
StepRewrites check_step_structure(std::string_view text, const std::string& source,
                                  std::size_t long_list = long_step_list);

}  // namespace stepframe::geometry
