#include "step_split.hpp"

#include <spdlog/spdlog.h>

#include <algorithm>
#include <array>
#include <cstdint>
#include <string_view>
#include <vector>

namespace stepframe::geometry::detail {

namespace {

constexpr std::uint32_t none = UINT32_MAX;

// A parenthesised list in an entity: `depth` 1 for a simple instance's parameters, 2 for a list standing
// as one of them; `pure` when it holds entity references only.
struct ListSpan {
  std::size_t open = 0, close = 0;
  std::uint32_t depth = 0;
  bool pure = true;
};

// A reference "#n" in an entity: the entity it names (its index once resolved) and the list directly
// holding it (none at the top level).
struct Ref {
  std::uint64_t target = 0;
  std::uint32_t list = none;
};

struct Entity {
  std::uint64_t id = 0;
  std::size_t begin = 0, end = 0;  // "#id" up to and with the ';'
  std::string_view type;           // the keyword after '='; empty for a complex instance
  std::uint32_t first_ref = 0, first_list = 0;
};

// The data section's entities, their references and lists, and where the text before and after them
// lies. The text has passed the structure check: anything unexpected here ends the split, not the read.
struct Scan {
  std::vector<Entity> entities;
  std::vector<Ref> refs;  // Entity::first_ref .. next entity's first_ref
  std::vector<ListSpan> lists;
  std::size_t data_begin = 0, data_end = 0;

  std::uint32_t ref_end(std::size_t k) const {
    return k + 1 < entities.size() ? entities[k + 1].first_ref : static_cast<std::uint32_t>(refs.size());
  }
  std::uint32_t list_end(std::size_t k) const {
    return k + 1 < entities.size() ? entities[k + 1].first_list : static_cast<std::uint32_t>(lists.size());
  }
};

bool token_char(char c) {
  return (c >= 'A' && c <= 'Z') || (c >= 'a' && c <= 'z') || (c >= '0' && c <= '9') || c == '_' || c == '.' ||
         c == '-' || c == '+' || c == '$' || c == '*' || c == '!';
}

bool blank(char c) { return c == ' ' || c == '\n' || c == '\r' || c == '\t'; }

std::optional<Scan> scan(std::string_view t) {
  Scan s;
  const std::size_t n = t.size();
  // Room for some three times what exported wireframes hold (the 100k bench file: one entity in 117
  // bytes, one reference in 36, one list in 28), so that the vectors rarely move while they fill: each
  // move copies them into fresh memory, and first touches of memory are dear (page faults were a third
  // of the split's time).
  s.entities.reserve(n / 40 + 16);
  s.refs.reserve(n / 12 + 16);
  s.lists.reserve(n / 10 + 16);
  std::vector<std::uint32_t> open;  // lists open at this point
  bool in_statement = false, is_entity = false, expect_type = false, after_data = false;
  std::size_t i = 0;
  auto impure = [&] {
    if (!open.empty()) s.lists[open.back()].pure = false;
  };
  auto digits = [&](std::uint64_t& value) {
    const std::size_t from = i;
    value = 0;
    while (i < n && t[i] >= '0' && t[i] <= '9' && i - from < 18)
      value = value * 10 + static_cast<std::uint64_t>(t[i++] - '0');
    return i > from;
  };
  while (i < n) {
    const char c = t[i];
    if (blank(c)) {
      ++i;
      continue;
    }
    if (c == '/' && i + 1 < n && t[i + 1] == '*') {
      const std::size_t close = t.find("*/", i + 2);
      if (close == std::string_view::npos) return std::nullopt;
      i = close + 2;
      continue;
    }
    if (!in_statement) {
      in_statement = true;
      is_entity = c == '#';
      if (!is_entity) {
        if (!s.entities.empty()) after_data = true;
      } else {
        if (after_data) return std::nullopt;  // a second data section
        if (s.entities.empty()) s.data_begin = i;
        Entity e;
        e.begin = i++;
        if (!digits(e.id)) return std::nullopt;
        while (i < n && blank(t[i])) ++i;
        if (i >= n || t[i] != '=') return std::nullopt;
        ++i;
        e.first_ref = static_cast<std::uint32_t>(s.refs.size());
        e.first_list = static_cast<std::uint32_t>(s.lists.size());
        s.entities.push_back(e);
        expect_type = true;
      }
      continue;
    }
    switch (c) {
      case '\'':
        impure();
        for (++i; i < n; ++i)
          if (t[i] == '\'') {
            if (i + 1 < n && t[i + 1] == '\'') ++i;
            else break;
          }
        ++i;
        break;
      case '"':
        impure();
        i = t.find('"', i + 1);
        if (i == std::string_view::npos) return std::nullopt;
        ++i;
        break;
      case '(':
        impure();  // a list inside a list is not a reference
        expect_type = false;
        open.push_back(static_cast<std::uint32_t>(s.lists.size()));
        s.lists.push_back({i, 0, static_cast<std::uint32_t>(open.size()), true});
        ++i;
        break;
      case ')':
        if (open.empty()) return std::nullopt;
        s.lists[open.back()].close = i++;
        open.pop_back();
        break;
      case ',':
        ++i;
        break;
      case ';':
        if (!open.empty()) return std::nullopt;
        if (is_entity) {
          s.entities.back().end = i + 1;
          s.data_end = i + 1;
        }
        in_statement = false;
        ++i;
        break;
      case '#': {
        ++i;
        Ref r;
        if (!is_entity || !digits(r.target)) return std::nullopt;
        r.list = open.empty() ? none : open.back();
        s.refs.push_back(r);
        break;
      }
      default: {
        const std::size_t from = i;
        while (i < n && token_char(t[i])) ++i;
        if (i == from) return std::nullopt;
        if (is_entity && expect_type && open.empty()) s.entities.back().type = t.substr(from, i - from);
        else impure();
        expect_type = false;
      }
    }
  }
  if (in_statement || s.entities.empty()) return std::nullopt;
  return s;
}

bool is_curve(std::string_view type) {
  static constexpr std::array<std::string_view, 7> curves{"LINE",   "TRIMMED_CURVE",   "POLYLINE",
                                                          "CIRCLE", "ELLIPSE",         "B_SPLINE_CURVE_WITH_KNOTS",
                                                          "COMPOSITE_CURVE"};
  return std::find(curves.begin(), curves.end(), type) != curves.end();
}

bool is_set(std::string_view type) { return type == "GEOMETRIC_CURVE_SET" || type == "GEOMETRIC_SET"; }

// Whether an entity outside the members could become an edge, a point or a body when OCCT reads it.
bool could_be_shape(std::string_view type, std::string_view text) {
  if (type.empty()) {  // a complex instance: contexts, units and relationships only
    for (std::string_view word :
         {"CURVE", "SURFACE", "EDGE", "VERTEX", "SHAPE_REPRESENTATION(", "SHAPE_REPRESENTATION ("})
      if (text.find(word) != std::string_view::npos) return true;
    return false;
  }
  if (is_curve(type) || is_set(type)) return true;
  if (type.rfind("SURFACE_STYLE", 0) == 0 || type.rfind("SURFACE_SIDE_STYLE", 0) == 0) return false;
  for (std::string_view word : {"EDGE", "VERTEX", "FACE", "SHELL", "BREP", "SURFACE", "SOLID", "WIREFRAME", "MAPPED_ITEM",
                                "REPRESENTATION_MAP", "POINT_SET"})
    if (type.find(word) != std::string_view::npos) return true;
  return false;
}

bool ends_with(std::string_view text, std::string_view end) {
  return text.size() >= end.size() && text.substr(text.size() - end.size()) == end;
}

std::optional<std::string> refuse(std::string_view why) {
  spdlog::debug("STEP text not split for two processes: {}", why);
  return std::nullopt;
}

// Where an entity outside the members goes: into both parts as it is, into one part only, or into both
// with its lists of references keeping each part's own.
enum class Place : std::uint8_t { unknown, visiting, both, first, second, filtered };

}  // namespace

std::optional<std::string> step_split_part(std::string_view text, std::size_t min_members, int part) {
  std::optional<Scan> scanned = scan(text);
  if (!scanned) return refuse("its data section is not laid out as one run of entity instances");
  Scan& s = *scanned;
  const std::size_t count = s.entities.size();

  // Entity ids to indices.
  std::uint64_t largest = 0;
  for (const Entity& e : s.entities) largest = std::max(largest, e.id);
  if (largest > 16 * count + 1024) return refuse("its entity ids are sparse");
  std::vector<std::uint32_t> index(largest + 1, none);
  for (std::size_t k = 0; k < count; ++k) index[s.entities[k].id] = static_cast<std::uint32_t>(k);
  for (Ref& r : s.refs) {
    if (r.target > largest || index[r.target] == none) return refuse("a reference names no entity");
    r.target = index[r.target];
  }
  auto type_of = [&](std::uint64_t k) { return s.entities[k].type; };
  // A list of references standing as one parameter of a simple instance: the only kind a part shortens.
  auto plain = [&](std::uint32_t l) { return l != none && s.lists[l].pure && s.lists[l].depth == 2; };
  auto body_of = [&](std::size_t k) {
    return text.substr(s.entities[k].begin, s.entities[k].end - s.entities[k].begin);
  };

  // The shape representation with the longest plain list of references: the members' list (not a
  // presentation representation, whose list of styled items can be as long).
  std::vector<std::uint32_t> list_refs(s.lists.size(), 0);
  for (const Ref& r : s.refs)
    if (plain(r.list)) ++list_refs[r.list];
  std::size_t holder = count;
  std::uint32_t members_list = none;
  for (std::size_t k = 0; k < count; ++k) {
    if (!ends_with(s.entities[k].type, "SHAPE_REPRESENTATION")) continue;
    for (std::uint32_t l = s.entities[k].first_list; l < s.list_end(k); ++l)
      if (list_refs[l] >= min_members && (members_list == none || list_refs[l] > list_refs[members_list])) {
        members_list = l;
        holder = k;
      }
  }
  if (members_list == none) return refuse("no representation lists enough members");

  // Its items: axis placements (kept in both parts) and the members, split into two halves in order.
  std::vector<std::uint8_t> owner(count, 0);  // 1: first half's member, 2: second's
  std::vector<std::uint32_t> roots;
  for (std::uint32_t r = s.entities[holder].first_ref; r < s.ref_end(holder); ++r) {
    if (s.refs[r].list != members_list) continue;
    const std::uint64_t item = s.refs[r].target;
    if (type_of(item) == "AXIS2_PLACEMENT_3D") continue;
    if (is_set(type_of(item))) {
      for (std::uint32_t e = s.entities[item].first_ref; e < s.ref_end(item); ++e)
        if (!is_curve(type_of(s.refs[e].target))) return refuse("a member's set holds something other than curves");
    } else if (!is_curve(type_of(item))) {
      return refuse("the representation lists items other than curves, curve sets and placements");
    }
    roots.push_back(static_cast<std::uint32_t>(item));
  }
  if (roots.size() < min_members) return refuse("too few members");
  const std::size_t half = (roots.size() + 1) / 2;
  std::size_t first_last = 0, second_first = text.size();
  for (std::size_t k = 0; k < roots.size(); ++k) {
    if (k < half) first_last = std::max(first_last, s.entities[roots[k]].begin);
    else second_first = std::min(second_first, s.entities[roots[k]].begin);
  }
  if (first_last > second_first) return refuse("the members are not listed in the order the file holds them");

  // Each member with everything it names: its half's alone.
  std::vector<std::uint32_t> stack;
  for (std::size_t k = 0; k < roots.size(); ++k) {
    const std::uint8_t half_of = k < half ? 1 : 2;
    stack.assign(1, roots[k]);
    while (!stack.empty()) {
      const std::uint32_t e = stack.back();
      stack.pop_back();
      if (owner[e] == half_of) continue;
      if (owner[e] != 0 || e == holder) return refuse("members of the two halves share entities");
      owner[e] = half_of;
      for (std::uint32_t r = s.entities[e].first_ref; r < s.ref_end(e); ++r)
        stack.push_back(static_cast<std::uint32_t>(s.refs[r].target));
    }
  }

  // The rest of the file: one placement of the representation, no shapes of its own.
  std::size_t products = 0, usages = 0, definitions = 0;
  for (std::size_t k = 0; k < count; ++k) {
    const std::string_view type = s.entities[k].type;
    products += type == "PRODUCT" ? 1 : 0;
    usages += type == "NEXT_ASSEMBLY_USAGE_OCCURRENCE" ? 1 : 0;
    if (owner[k] != 0 || k == holder) continue;
    if (type == "SHAPE_DEFINITION_REPRESENTATION")
      for (std::uint32_t r = s.entities[k].first_ref; r < s.ref_end(k); ++r)
        definitions += s.refs[r].target == holder ? 1 : 0;
    if (could_be_shape(type, body_of(k))) return refuse("an entity outside the members could be read as a shape");
    if (ends_with(type, "SHAPE_REPRESENTATION"))
      for (std::uint32_t r = s.entities[k].first_ref; r < s.ref_end(k); ++r)
        if (plain(s.refs[r].list) && type_of(s.refs[r].target) != "AXIS2_PLACEMENT_3D")
          return refuse("another shape representation lists items");
  }
  if (products > 2 || usages > 1 || definitions > 1)
    return refuse("the members' representation may be placed more than once");

  // Where every other entity goes, from what it names (references first: an explicit stack).
  std::vector<Place> place(count, Place::unknown);
  auto halves = [&](std::uint32_t e) -> std::uint8_t {  // the halves an entity belongs to alone
    if (owner[e] != 0) return owner[e];
    return place[e] == Place::first ? 1 : place[e] == Place::second ? 2 : 0;
  };
  std::vector<std::pair<std::uint32_t, std::uint32_t>> walk;  // entity, next reference to look at
  for (std::size_t start = 0; start < count; ++start) {
    if (owner[start] != 0 || place[start] != Place::unknown) continue;
    walk.assign(1, {static_cast<std::uint32_t>(start), s.entities[start].first_ref});
    place[start] = Place::visiting;
    while (!walk.empty()) {
      auto& [e, next] = walk.back();
      if (next < s.ref_end(e)) {
        const auto target = static_cast<std::uint32_t>(s.refs[next++].target);
        if (owner[target] == 0 && place[target] == Place::visiting) return refuse("its references form a cycle");
        if (owner[target] == 0 && place[target] == Place::unknown) {
          place[target] = Place::visiting;
          walk.push_back({target, s.entities[target].first_ref});
        }
        continue;
      }
      std::uint8_t touched = 0;
      bool listed = !s.entities[e].type.empty();  // a complex instance's records are not shortened
      for (std::uint32_t r = s.entities[e].first_ref; r < s.ref_end(e); ++r) {
        const std::uint8_t h = halves(static_cast<std::uint32_t>(s.refs[r].target));
        touched |= h;
        listed = listed && (h == 0 || plain(s.refs[r].list));
      }
      if (touched == 3 && !listed)
        return refuse(fmt::format("#{} names members of both halves outside a list", s.entities[e].id));
      constexpr std::array<Place, 4> by_halves{Place::both, Place::first, Place::second, Place::filtered};
      place[e] = by_halves[touched];
      walk.pop_back();
    }
  }

  // The part's text: the header, its entities in file order (lists of filtered ones keeping this part's
  // members and everything else), the end.
  const std::uint8_t mine = part == 0 ? 1 : 2;
  std::string out;
  out.reserve(text.size() / 2 + text.size() / 8);
  out.append(text.substr(0, s.data_begin));
  for (std::size_t k = 0; k < count; ++k) {
    const Entity& e = s.entities[k];
    const std::uint8_t h = halves(static_cast<std::uint32_t>(k));
    if (h != 0 && h != mine) continue;
    if (place[k] != Place::filtered) {
      out.append(body_of(k));
      out.push_back('\n');
      continue;
    }
    std::size_t at = e.begin;
    std::uint32_t r = e.first_ref;
    for (std::uint32_t l = e.first_list; l < s.list_end(k); ++l) {
      const ListSpan& list = s.lists[l];
      if (!plain(l)) continue;
      while (r < s.ref_end(k) && s.refs[r].list != l) ++r;
      if (r == s.ref_end(k)) break;
      out.append(text.substr(at, list.open + 1 - at));
      bool any = false;
      for (std::uint32_t q = r; q < s.ref_end(k) && s.refs[q].list == l; ++q) {
        const std::uint8_t of = halves(static_cast<std::uint32_t>(s.refs[q].target));
        if (of != 0 && of != mine) continue;
        if (any) out.push_back(',');
        out.push_back('#');
        out.append(std::to_string(s.entities[s.refs[q].target].id));
        any = true;
      }
      if (!any) return refuse(fmt::format("a list of #{} would be empty in one part", e.id));
      at = list.close;
    }
    out.append(text.substr(at, e.end - at));
    out.push_back('\n');
  }
  out.append(text.substr(s.data_end));
  return out;
}

}  // namespace stepframe::geometry::detail
