#include "step_model_bytes.hpp"

#include <cstdint>
#include <cstring>
#include <type_traits>

namespace stepframe::geometry::detail {

namespace {

// Appends values as their bytes; sizes as 64-bit counts.
class Writer {
 public:
  template <class T>
  void raw(const T& value) {
    static_assert(std::is_trivially_copyable_v<T>);
    out_.append(reinterpret_cast<const char*>(&value), sizeof value);
  }
  void operator()(double value) { raw(value); }
  void operator()(Severity value) { raw(static_cast<std::int32_t>(value)); }
  void operator()(const Eigen::Vector3d& v) { out_.append(reinterpret_cast<const char*>(v.data()), 3 * sizeof(double)); }
  void operator()(const std::string& s) {
    raw(static_cast<std::uint64_t>(s.size()));
    out_.append(s);
  }
  void operator()(const std::filesystem::path& p) { (*this)(p.string()); }
  void operator()(const std::optional<Eigen::Vector3d>& v) {
    raw(static_cast<std::uint8_t>(v.has_value()));
    if (v) (*this)(*v);
  }
  void operator()(const std::vector<std::string>& list) {
    list_of(list, [&](const std::string& s) { (*this)(s); });
  }
  template <class T, class Each>
  void list_of(const std::vector<T>& list, Each each) {
    raw(static_cast<std::uint64_t>(list.size()));
    for (const T& item : list) each(item);
  }
  std::string take() { return std::move(out_); }

 private:
  std::string out_;
};

// Reads what Writer wrote into the same fields; a short or overlong message fails (ok() false).
class Reader {
 public:
  explicit Reader(std::string_view in) : in_(in) {}
  bool at_end() const { return ok_ && in_.empty(); }

  template <class T>
  T raw() {
    T value{};
    if (take(sizeof value)) std::memcpy(&value, in_.data() - sizeof value, sizeof value);
    return value;
  }
  void operator()(double& value) { value = raw<double>(); }
  void operator()(Severity& value) { value = static_cast<Severity>(raw<std::int32_t>()); }
  void operator()(Eigen::Vector3d& v) {
    if (take(3 * sizeof(double))) std::memcpy(v.data(), in_.data() - 3 * sizeof(double), 3 * sizeof(double));
  }
  void operator()(std::string& s) {
    const std::size_t n = count();
    if (take(n)) s.assign(in_.data() - n, n);
  }
  void operator()(std::filesystem::path& p) {
    std::string s;
    (*this)(s);
    p = s;
  }
  void operator()(std::optional<Eigen::Vector3d>& v) {
    v.reset();
    if (raw<std::uint8_t>() == 0) return;
    (*this)(v.emplace());
  }
  void operator()(std::vector<std::string>& list) {
    list_of(list, [&](std::string& s) { (*this)(s); });
  }
  template <class T, class Each>
  void list_of(std::vector<T>& list, Each each) {
    list.resize(count());
    for (T& item : list) each(item);
  }

 private:
  std::size_t count() {
    const auto n = raw<std::uint64_t>();
    if (n > in_.size()) ok_ = false;  // every item takes at least one byte
    return ok_ ? static_cast<std::size_t>(n) : 0;
  }
  bool take(std::size_t n) {
    if (!ok_ || n > in_.size()) return ok_ = false;
    in_.remove_prefix(n);
    return true;
  }
  std::string_view in_;
  bool ok_ = true;
};

// Every field, in one order for both directions (`Read` and `Source` are const for the writer).
template <class Io, class Source>
void source_fields(Io& io, Source& s) {
  io(s.entity);
  io(s.name);
  io(s.layers);
  io(s.product);
  io(s.colour);
  io(s.assembly_path);
}

template <class Io, class Read>
void fields(Io& io, Read& read) {
  auto& m = read.model;
  io(m.file);
  io(m.length_unit);
  io(m.metres_per_unit);
  io.list_of(m.edges, [&](auto& e) {
    io(e.start);
    io(e.end);
    source_fields(io, e.source);
    io.list_of(e.curve, [&](auto& s) {
      io(s.point);
      io(s.turn);
    });
  });
  io.list_of(m.points, [&](auto& p) {
    io(p.at);
    source_fields(io, p.source);
  });
  io.list_of(m.diagnostics, [&](auto& d) {
    io(d.severity);
    io(d.code);
    io(d.message);
    io(d.entities);
    io(d.at);
  });
  io(read.occt_messages);
}

constexpr std::uint64_t tag = 0x5354'4550'4652'4d31ULL;  // marks a message of this layout

}  // namespace

std::string to_bytes(const ModelWithMessages& read) {
  Writer w;
  w.raw(tag);
  fields(w, read);
  w.raw(tag);
  return w.take();
}

std::optional<ModelWithMessages> from_bytes(std::string_view bytes) {
  Reader r(bytes);
  if (r.raw<std::uint64_t>() != tag) return std::nullopt;
  ModelWithMessages read;
  fields(r, read);
  if (r.raw<std::uint64_t>() != tag || !r.at_end()) return std::nullopt;
  return read;
}

}  // namespace stepframe::geometry::detail
