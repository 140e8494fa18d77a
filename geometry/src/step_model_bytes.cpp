#include "step_model_bytes.hpp"

#include <cstdint>
#include <cstring>
#include <type_traits>

namespace stepframe::geometry::detail {

namespace {

class Writer {
 public:
  template <class T>
  void raw(const T& value) {
    static_assert(std::is_trivially_copyable_v<T>);
    out_.append(reinterpret_cast<const char*>(&value), sizeof value);
  }
  void text(std::string_view s) {
    raw(static_cast<std::uint64_t>(s.size()));
    out_.append(s);
  }
  void vector(const Eigen::Vector3d& v) { out_.append(reinterpret_cast<const char*>(v.data()), 3 * sizeof(double)); }
  void texts(const std::vector<std::string>& list) {
    raw(static_cast<std::uint64_t>(list.size()));
    for (const std::string& s : list) text(s);
  }
  void source(const SourceInfo& s) {
    text(s.entity);
    text(s.name);
    texts(s.layers);
    text(s.product);
    text(s.colour);
    text(s.assembly_path);
  }
  std::string take() { return std::move(out_); }

 private:
  std::string out_;
};

// Reads what Writer wrote; every read checks the length left, and a short or overlong message fails.
class Reader {
 public:
  explicit Reader(std::string_view in) : in_(in) {}
  bool ok() const { return ok_; }
  bool at_end() const { return ok_ && in_.empty(); }

  template <class T>
  T raw() {
    T value{};
    if (!take(sizeof value)) return value;
    std::memcpy(&value, in_.data() - sizeof value, sizeof value);
    return value;
  }
  std::size_t count() {
    const auto n = raw<std::uint64_t>();
    if (n > in_.size()) ok_ = false;  // every item takes at least one byte
    return ok_ ? static_cast<std::size_t>(n) : 0;
  }
  std::string text() {
    const std::size_t n = count();
    if (!take(n)) return {};
    return std::string(in_.data() - n, n);
  }
  Eigen::Vector3d vector() {
    Eigen::Vector3d v = Eigen::Vector3d::Zero();
    if (take(3 * sizeof(double))) std::memcpy(v.data(), in_.data() - 3 * sizeof(double), 3 * sizeof(double));
    return v;
  }
  std::vector<std::string> texts() {
    std::vector<std::string> list(count());
    for (std::string& s : list) s = text();
    return list;
  }
  SourceInfo source() {
    SourceInfo s;
    s.entity = text();
    s.name = text();
    s.layers = texts();
    s.product = text();
    s.colour = text();
    s.assembly_path = text();
    return s;
  }

 private:
  bool take(std::size_t n) {
    if (!ok_ || n > in_.size()) return ok_ = false;
    in_.remove_prefix(n);
    return true;
  }
  std::string_view in_;
  bool ok_ = true;
};

constexpr std::uint64_t tag = 0x5354'4550'4652'4d31ULL;  // marks a message of this layout

}  // namespace

std::string to_bytes(const ModelWithMessages& read) {
  const StepModel& m = read.model;
  Writer w;
  w.raw(tag);
  w.text(m.file.string());
  w.text(m.length_unit);
  w.raw(m.metres_per_unit);
  w.raw(static_cast<std::uint64_t>(m.edges.size()));
  for (const WireEdge& e : m.edges) {
    w.vector(e.start);
    w.vector(e.end);
    w.source(e.source);
    w.raw(static_cast<std::uint64_t>(e.curve.size()));
    for (const CurveSample& s : e.curve) {
      w.vector(s.point);
      w.raw(s.turn);
    }
  }
  w.raw(static_cast<std::uint64_t>(m.points.size()));
  for (const LabelledPoint& p : m.points) {
    w.vector(p.at);
    w.source(p.source);
  }
  w.raw(static_cast<std::uint64_t>(m.diagnostics.size()));
  for (const Diagnostic& d : m.diagnostics) {
    w.raw(static_cast<std::int32_t>(d.severity));
    w.text(d.code);
    w.text(d.message);
    w.texts(d.entities);
    w.raw(static_cast<std::uint8_t>(d.at.has_value()));
    if (d.at) w.vector(*d.at);
  }
  w.texts(read.occt_messages);
  w.raw(tag);
  return w.take();
}

std::optional<ModelWithMessages> from_bytes(std::string_view bytes) {
  Reader r(bytes);
  ModelWithMessages read;
  StepModel& m = read.model;
  if (r.raw<std::uint64_t>() != tag) return std::nullopt;
  m.file = r.text();
  m.length_unit = r.text();
  m.metres_per_unit = r.raw<double>();
  m.edges.resize(r.count());
  for (WireEdge& e : m.edges) {
    e.start = r.vector();
    e.end = r.vector();
    e.source = r.source();
    e.curve.resize(r.count());
    for (CurveSample& s : e.curve) {
      s.point = r.vector();
      s.turn = r.raw<double>();
    }
  }
  m.points.resize(r.count());
  for (LabelledPoint& p : m.points) {
    p.at = r.vector();
    p.source = r.source();
  }
  m.diagnostics.resize(r.count());
  for (Diagnostic& d : m.diagnostics) {
    d.severity = static_cast<Severity>(r.raw<std::int32_t>());
    d.code = r.text();
    d.message = r.text();
    d.entities = r.texts();
    if (r.raw<std::uint8_t>() != 0) d.at = r.vector();
  }
  read.occt_messages = r.texts();
  if (r.raw<std::uint64_t>() != tag || !r.at_end()) return std::nullopt;
  return read;
}

}  // namespace stepframe::geometry::detail
