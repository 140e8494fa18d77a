#include "shell_wireframes.hpp"

#include <algorithm>
#include <cctype>
#include <map>
#include <string>
#include <utility>
#include <vector>

namespace stepframe::geometry::detail {

namespace {

// One simple entity instance "#n = TYPE(args);" of an exchange structure
// (ISO 10303-21): where its right-hand side lies in the text, its type and
// its top-level arguments as text.
struct Instance {
  std::size_t begin = 0, end = 0;  // the right-hand side, [begin, end)
  std::string type;
  std::vector<std::string> args;
};

std::string trim(std::string_view s) {
  std::size_t a = 0, b = s.size();
  while (a < b && std::isspace(static_cast<unsigned char>(s[a]))) ++a;
  while (b > a && std::isspace(static_cast<unsigned char>(s[b - 1]))) --b;
  return std::string(s.substr(a, b - a));
}

// Splits "a, (b, c), 'd,e'" at its top-level commas.
std::vector<std::string> split_args(std::string_view s) {
  std::vector<std::string> out;
  int depth = 0;
  bool quoted = false;
  std::size_t start = 0;
  for (std::size_t i = 0; i < s.size(); ++i) {
    const char c = s[i];
    if (c == '\'') quoted = !quoted;  // a doubled quote toggles twice
    if (quoted) continue;
    if (c == '(') ++depth;
    if (c == ')') --depth;
    if (c == ',' && depth == 0) {
      out.push_back(trim(s.substr(start, i - start)));
      start = i + 1;
    }
  }
  out.push_back(trim(s.substr(start)));
  return out;
}

// {"a", "b"} -> "a,b".
std::string joined(const std::vector<std::string>& items) {
  std::string out;
  for (std::size_t k = 0; k < items.size(); ++k) out += (k ? "," : "") + items[k];
  return out;
}

// "(#1,#2)" -> {"#1", "#2"}.
std::vector<std::string> list_items(const std::string& list) {
  if (list.size() < 2 || list.front() != '(' || list.back() != ')') return {};
  return split_args(std::string_view(list).substr(1, list.size() - 2));
}

// Every simple instance of the DATA section, by entity name ("#12").
std::map<std::string, Instance> scan(std::string_view text) {
  std::map<std::string, Instance> instances;
  std::size_t i = text.find("DATA;");
  if (i == std::string_view::npos) return instances;
  i += 5;
  while (i < text.size()) {
    // Find the end of the statement, skipping strings and comments.
    std::size_t start = i;
    bool quoted = false;
    std::size_t j = i;
    for (; j < text.size(); ++j) {
      const char c = text[j];
      if (!quoted && c == '/' && j + 1 < text.size() && text[j + 1] == '*') {
        const std::size_t close = text.find("*/", j + 2);
        if (close == std::string_view::npos) return instances;
        j = close + 1;
        continue;
      }
      if (c == '\'') quoted = !quoted;
      if (!quoted && c == ';') break;
    }
    if (j >= text.size()) break;
    std::string_view statement = text.substr(start, j - start);
    i = j + 1;
    // Skip leading comments and blanks.
    while (true) {
      const std::string lead = trim(statement);
      if (lead.rfind("/*", 0) == 0) {
        const std::size_t close = statement.find("*/");
        if (close == std::string_view::npos) break;
        start += close + 2;
        statement = statement.substr(close + 2);
        continue;
      }
      break;
    }
    const std::size_t equals = statement.find('=');
    if (equals == std::string_view::npos) continue;
    const std::string name = trim(statement.substr(0, equals));
    if (name.empty() || name[0] != '#') continue;
    const std::size_t rhs = start + equals + 1;
    std::string_view body = text.substr(rhs, j - rhs);
    const std::size_t open = body.find('(');
    if (open == std::string_view::npos || body.find_last_of(')') == std::string_view::npos) continue;
    Instance instance;
    instance.begin = rhs;
    instance.end = j;
    instance.type = trim(body.substr(0, open));
    const std::size_t close = body.find_last_of(')');
    instance.args = split_args(body.substr(open + 1, close - open - 1));
    instances.emplace(name, std::move(instance));
  }
  return instances;
}

}  // namespace

bool mentions_shell_wireframes(std::string_view step_text) {
  return step_text.find("SHELL_BASED_WIREFRAME") != std::string_view::npos;
}

std::optional<std::string> rewrite_shell_wireframes(std::string_view step_text) {
  if (!mentions_shell_wireframes(step_text)) return std::nullopt;
  const std::map<std::string, Instance> instances = scan(step_text);
  auto type_of = [&](const std::string& id) -> const Instance* {
    const auto it = instances.find(id);
    return it == instances.end() ? nullptr : &it->second;
  };
  // Argument `index` of instance `id` when it is of `type`, else "".
  auto argument = [&](const std::string& id, const char* type, std::size_t index) -> std::string {
    const Instance* i = type_of(id);
    return i != nullptr && i->type == type && i->args.size() > index ? i->args[index] : std::string();
  };
  // Replacements of right-hand sides, by position in the text.
  std::map<std::size_t, std::pair<std::size_t, std::string>> edits;
  // The vertex shells of each shell-based model, rewritten as point sets.
  std::map<std::string, std::vector<std::string>> point_sets_of;
  // The models left without a wire shell.
  std::vector<std::string> without_edges;
  for (const auto& [id, instance] : instances) {
    if (instance.type != "SHELL_BASED_WIREFRAME_MODEL" || instance.args.size() != 2) continue;
    std::string shells;
    for (const std::string& shell : list_items(instance.args[1])) {
      const Instance* s = type_of(shell);
      if (s == nullptr) continue;
      if (s->type == "VERTEX_SHELL" && s->args.size() == 2) {
        // VERTEX_SHELL(name, VERTEX_LOOP(name, VERTEX_POINT(name, point)))
        const std::string point = argument(argument(s->args[1], "VERTEX_LOOP", 1), "VERTEX_POINT", 1);
        if (point.empty()) continue;
        edits[s->begin] = {s->end, "GEOMETRIC_SET(" + s->args[0] + ",(" + point + "))"};
        point_sets_of[id].push_back(shell);
        continue;
      }
      if (s->type != "WIRE_SHELL" || s->args.size() != 2) continue;
      // The shell's loops' oriented edges, by their edge elements.
      std::string edges;
      for (const std::string& loop : list_items(s->args[1])) {
        const Instance* l = type_of(loop);
        if (l == nullptr || l->type != "EDGE_LOOP" || l->args.size() != 2) continue;
        for (const std::string& oriented : list_items(l->args[1])) {
          const Instance* o = type_of(oriented);
          // ORIENTED_EDGE(name, *, *, edge_element, orientation)
          const std::string edge = o != nullptr && o->type == "ORIENTED_EDGE" && o->args.size() == 5 ? o->args[3]
                                                                                                    : oriented;
          edges += (edges.empty() ? "" : ",") + edge;
        }
      }
      if (edges.empty()) continue;  // no edge to carry over (OCCT crashes on an empty edge set)
      edits[s->begin] = {s->end, "CONNECTED_EDGE_SET(" + s->args[0] + ",(" + edges + "))"};
      shells += (shells.empty() ? "" : ",") + shell;
    }
    if (shells.empty()) {
      // No wire shell with edges (OCCT crashes on an empty edge-based model): an empty curve set,
      // which OCCT reads safely, takes its place and the representation no longer lists it.
      edits[instance.begin] = {instance.end, "GEOMETRIC_CURVE_SET(" + instance.args[0] + ",())"};
      without_edges.push_back(id);
      continue;
    }
    edits[instance.begin] = {instance.end, "EDGE_BASED_WIREFRAME_MODEL(" + instance.args[0] + ",(" + shells + "))"};
  }
  for (const auto& [id, instance] : instances) {
    if (instance.type != "SHELL_BASED_WIREFRAME_SHAPE_REPRESENTATION") continue;
    std::vector<std::string> args = instance.args;
    if (args.size() == 3) {
      std::vector<std::string> items = list_items(args[1]);
      for (std::size_t k = 0, n = items.size(); k < n; ++k)
        if (const auto sets = point_sets_of.find(items[k]); sets != point_sets_of.end())
          items.insert(items.end(), sets->second.begin(), sets->second.end());
      std::erase_if(items, [&](const std::string& item) {
        return std::find(without_edges.begin(), without_edges.end(), item) != without_edges.end();
      });
      args[1] = "(" + joined(items) + ")";
    }
    edits[instance.begin] = {instance.end, "EDGE_BASED_WIREFRAME_SHAPE_REPRESENTATION(" + joined(args) + ")"};
  }
  std::string out;
  out.reserve(step_text.size());
  std::size_t at = 0;
  for (const auto& [begin, edit] : edits) {
    out.append(step_text.substr(at, begin - at));
    out.append(edit.second);
    at = edit.first;
  }
  out.append(step_text.substr(at));
  return out;
}

}  // namespace stepframe::geometry::detail
