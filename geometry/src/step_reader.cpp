#include "stepframe/geometry/step_reader.hpp"
#include "stepframe/geometry/step_structure.hpp"

#include "assembly_loops.hpp"
#include "declared_length_unit.hpp"
#include "edge_entities.hpp"
#include "harvest.hpp"
#include "occt_messages.hpp"
#include "shell_wireframes.hpp"
#include "step_long_lists.hpp"
#include "step_long_strings.hpp"
#include "step_quotes.hpp"
#include "step_two_processes.hpp"
#include "step_attributes.hpp"
#include "step_kind.hpp"
#include "step_origins.hpp"
#include "unread_entities.hpp"
#include "xde_document.hpp"

#include <BRepAdaptor_Curve.hxx>
#include <BRep_Tool.hxx>
#include <IFSelect_ReturnStatus.hxx>
#include <Precision.hxx>
#include <STEPCAFControl_Controller.hxx>
#include <STEPCAFControl_Reader.hxx>
#include <STEPControl_Reader.hxx>
#include <Standard_Failure.hxx>
#include <StepData_StepModel.hxx>
#include <StepGeom_CartesianPoint.hxx>
#include <StepGeom_Curve.hxx>
#include <StepGeom_HArray1OfTrimmingSelect.hxx>
#include <StepGeom_TrimmedCurve.hxx>
#include <StepShape_ConnectedEdgeSet.hxx>
#include <StepShape_EdgeCurve.hxx>
#include <StepShape_Vertex.hxx>
#include <StepShape_VertexPoint.hxx>
#include <gp_Vec.hxx>
#include <StepShape_EdgeBasedWireframeModel.hxx>
#include <StepShape_GeometricSet.hxx>
#include <StepShape_HArray1OfConnectedEdgeSet.hxx>
#include <StepShape_HArray1OfEdge.hxx>
#include <StepShape_HArray1OfGeometricSetSelect.hxx>
#include <TColStd_Array1OfReal.hxx>
#include <TCollection_AsciiString.hxx>
#include <TDF_Label.hxx>
#include <TDF_LabelSequence.hxx>
#include <TDataStd_Name.hxx>
#include <TDocStd_Document.hxx>
#include <TopAbs_ShapeEnum.hxx>
#include <TopExp_Explorer.hxx>
#include <TopLoc_Location.hxx>
#include <TopoDS.hxx>
#include <TopoDS_Edge.hxx>
#include <TopoDS_Shape.hxx>
#include <Transfer_TransientProcess.hxx>
#include <XCAFDoc_DocumentTool.hxx>
#include <XCAFDoc_ShapeTool.hxx>
#include <XSControl_TransferReader.hxx>
#include <XSControl_WorkSession.hxx>

#include <spdlog/fmt/fmt.h>
#include <spdlog/spdlog.h>

#include <algorithm>
#include <cerrno>
#include <cstring>
#include <fstream>
#include <mutex>
#include <optional>
#include <system_error>
#include <unordered_set>
#include <utility>

#if defined(__GLIBC__)
#include <malloc.h>  // malloc_trim
#endif

namespace stepframe::geometry {

namespace {

constexpr const char* export_advice =
    "Export the frame from the CAD program as a STEP (ISO 10303-21) wireframe: one curve per member centreline, "
    "as a geometric curve set or an edge-based or shell-based wireframe.";

[[noreturn]] void fail(const std::string& source, const std::string& what) {
  throw StepReadError(fmt::format("{}: {}", source, what));
}

bool coincident_trims(const Handle(StepGeom_TrimmedCurve) & curve) {
  const Handle(StepGeom_HArray1OfTrimmingSelect) first = curve->Trim1();
  const Handle(StepGeom_HArray1OfTrimmingSelect) second = curve->Trim2();
  if (first.IsNull() || second.IsNull()) return false;
  for (Standard_Integer i = first->Lower(); i <= first->Upper(); ++i) {
    for (Standard_Integer k = second->Lower(); k <= second->Upper(); ++k) {
      const StepGeom_TrimmingSelect& a = first->Value(i);
      const StepGeom_TrimmingSelect& b = second->Value(k);
      const Handle(StepGeom_CartesianPoint) pa = a.CartesianPoint();
      const Handle(StepGeom_CartesianPoint) pb = b.CartesianPoint();
      if (!pa.IsNull() && !pb.IsNull() && pa->NbCoordinates() == pb->NbCoordinates()) {
        bool same = true;
        for (Standard_Integer c = 1; c <= pa->NbCoordinates(); ++c)
          same = same && pa->CoordinatesValue(c) == pb->CoordinatesValue(c);
        if (same) return true;
      }
      if (pa.IsNull() && pb.IsNull() && a.ParameterValue() == b.ParameterValue()) return true;
    }
  }
  return false;
}

// Curves of geometric sets and edges of edge-based wireframes that produced no
// edge at all: OCCT could not translate them, or they have no length.
void report_untranslated(const Handle(StepData_StepModel) & model, const detail::StepAttributes& attributes,
                         const std::unordered_set<const Standard_Transient*>& reached,
                         std::vector<Diagnostic>& diagnostics) {
  auto report = [&](const Handle(Standard_Transient) & item) {
    if (item.IsNull() || reached.count(item.get()) != 0) return;
    const std::string id = attributes.entity_id(item);
    if (auto trimmed = detail::as_kind<StepGeom_TrimmedCurve>(item); !trimmed.IsNull() && coincident_trims(trimmed)) {
      diagnostics.push_back({Severity::warning, "zero-length-edge",
                             fmt::format("{} (TRIMMED_CURVE) starts and ends at the same place; it was dropped", id),
                             {id}, std::nullopt});
      return;
    }
    diagnostics.push_back({Severity::warning, "curve-not-translated",
                           fmt::format("{} ({}) gave no edge: OCCT could not translate it, or it is not placed in "
                                       "any product. Check this entity in the file.",
                                       id, item->DynamicType()->Name()),
                           {id}, std::nullopt});
  };
  for (Standard_Integer i = 1; i <= model->NbEntities(); ++i) {
    const Handle(Standard_Transient)& entity = model->Value(i);
    if (auto set = detail::as_kind<StepShape_GeometricSet>(entity); !set.IsNull()) {
      if (set->Elements().IsNull()) continue;
      for (Standard_Integer k = 1; k <= set->NbElements(); ++k) {
        const Handle(Standard_Transient) element = set->ElementsValue(k).Value();
        if (!element.IsNull() && element->IsKind(STANDARD_TYPE(StepGeom_Curve))) report(element);
      }
    } else if (auto wireframe = detail::as_kind<StepShape_EdgeBasedWireframeModel>(entity); !wireframe.IsNull()) {
      const Handle(StepShape_HArray1OfConnectedEdgeSet) sets = wireframe->EbwmBoundary();
      if (sets.IsNull()) continue;
      for (Standard_Integer s = sets->Lower(); s <= sets->Upper(); ++s) {
        if (sets->Value(s).IsNull() || sets->Value(s)->CesEdges().IsNull()) continue;
        const Handle(StepShape_HArray1OfEdge) edges = sets->Value(s)->CesEdges();
        for (Standard_Integer k = edges->Lower(); k <= edges->Upper(); ++k) report(edges->Value(k));
      }
    }
  }
}


// An input stream over text held elsewhere, read in place: OCCT's parser takes a std::istream, and an
// istringstream would hold a copy of the text (some 50 MB for a 100,000-member frame).
class TextStream : public std::istream {
 public:
  explicit TextStream(std::string_view text) : std::istream(nullptr), buffer_(text) { rdbuf(&buffer_); }

 private:
  struct Buffer : std::streambuf {
    explicit Buffer(std::string_view text) {
      char* begin = const_cast<char*>(text.data());  // the get area is only read
      setg(begin, begin, begin + text.size());
    }
  } buffer_;
};

// The whole file as text, in one block of its size (a stream read into an ostringstream grows its
// buffer by doubling, and str() copies it once more).
std::string file_text(const std::filesystem::path& file, const std::string& source) {
  std::ifstream in(file, std::ios::binary | std::ios::ate);
  const std::streamoff size = in ? static_cast<std::streamoff>(in.tellg()) : -1;
  std::string text(size > 0 ? static_cast<std::size_t>(size) : 0, '\0');
  if (size < 0 || !in.seekg(0) || !in.read(text.data(), size))
    fail(source, "could not be read to its end; check the file");
  return text;
}

// Everything after the parse: transfer into an XDE document, units,
// attributes, the walk over the assembly tree and the findings.
StepModel read_parsed(STEPCAFControl_Reader& reader, const std::string& source) {
  const Handle(XSControl_WorkSession) session = reader.Reader().WS();
  const Handle(StepData_StepModel) step_model = reader.Reader().StepModel();
  if (step_model.IsNull() || step_model->NbEntities() == 0)
    fail(source, fmt::format("holds no STEP entities. {}", export_advice));

  const std::vector<detail::UnreadEntity> unread = detail::unread_entities(step_model);
  const auto refused = std::find_if(unread.begin(), unread.end(), [](const auto& u) { return !u.presentation; });
  if (refused != unread.end()) {
    const auto count = std::count_if(unread.begin(), unread.end(), [](const auto& u) { return !u.presentation; });
    fail(source, fmt::format("OCCT could not read entity #{} ({}: {}); its translation would follow the broken "
                             "reference, so the file is refused{}. Correct the entity in the file: a misspelt or "
                             "unknown entity type, or an entity of the wrong type where this one refers to it. {}",
                             refused->entity, refused->type, refused->failures,
                             count > 1 ? fmt::format(" ({} such entities in all)", count) : "", export_advice));
  }

  if (const std::vector<int> loop = detail::assembly_loop(step_model); !loop.empty()) {
    std::string steps;
    for (std::size_t k = 0; k + 2 < loop.size(); k += 2)
      steps += fmt::format("{}#{} holds #{}, whose part is #{}", k == 0 ? "" : "; ", loop[k], loop[k + 1], loop[k + 2]);
    fail(source, fmt::format("its assembly #{} contains itself ({}: a NEXT_ASSEMBLY_USAGE_OCCURRENCE's part is its "
                             "related product definition and the one whose shape its "
                             "CONTEXT_DEPENDENT_SHAPE_REPRESENTATION names); an assembly cannot contain itself, and "
                             "OCCT's translation of such a loop recurses without end. Correct the assembly structure "
                             "in the CAD model. {}",
                             loop.front(), steps, export_advice));
  }

  detail::XdeDocument document;
  // OCCT converts coordinates into the document's unit; fix it to millimetres
  // and read it back below rather than trusting the session default.
  XCAFDoc_DocumentTool::SetLengthUnit(document.get(), 1e-3);
  bool transferred = false;
  try {
    transferred = reader.Transfer(document.get());
  } catch (const Standard_Failure& failure) {
    fail(source, fmt::format("OCCT failed while translating its shapes ({}). {}", failure.GetMessageString(),
                             export_advice));
  }
  if (!transferred) fail(source, fmt::format("OCCT found no shapes to translate in it. {}", export_advice));

  double metres_per_model_unit = 1e-3;
  if (Standard_Real unit = 0.0; XCAFDoc_DocumentTool::GetLengthUnit(document.get(), unit) && unit > 0.0)
    metres_per_model_unit = unit;

  StepModel model;
  model.file = source;
  for (const detail::UnreadEntity& u : unread)  // presentation entities only: the others were refused above
    model.diagnostics.push_back({Severity::warning, "step-entity-unread",
                                 fmt::format("OCCT could not read #{} ({}: {}); its layers, styles or colours are "
                                             "ignored",
                                             u.entity, u.type, u.failures),
                                 {fmt::format("#{}", u.entity)}, std::nullopt});

  const std::vector<detail::DeclaredLengthUnit> units = detail::declared_length_units(step_model);
  if (units.empty()) {
    model.length_unit = "mm";
    model.metres_per_unit = 1e-3;
    model.diagnostics.push_back({Severity::warning, "no-length-unit",
                                 "the file declares no length unit; OCCT read its coordinates as millimetres",
                                 {}, std::nullopt});
  } else {
    model.length_unit = units.front().name;
    model.metres_per_unit = units.front().metres_per_unit;
    if (units.size() > 1) {
      std::string names;
      for (const auto& unit : units) names += (names.empty() ? "" : ", ") + unit.name;
      model.diagnostics.push_back(
          {Severity::info, "mixed-length-units",
           fmt::format("the file declares several length units ({}); each part's coordinates were converted "
                       "from its own unit, and {} is reported as the file's unit",
                       names, model.length_unit),
           {}, std::nullopt});
    }
  }
  const Handle(Transfer_TransientProcess) process = session->TransferReader()->TransientProcess();
  const detail::EdgeEntityMap edge_entities = detail::map_edges_to_entities(process);
  const detail::StepAttributes attributes(session);
  const detail::StepOrigins origins(edge_entities, attributes);

  detail::Harvest harvest{origins, metres_per_model_unit, model, {}, {}, 0, 0, 0};
  detail::harvest_document(document.get(), harvest);
  report_untranslated(step_model, attributes, harvest.reached, model.diagnostics);
  detail::finish_harvest(harvest, source, export_advice);
  spdlog::info("{}: {} edges, {} labelled points, length unit {} ({} m), {} diagnostics", source, model.edges.size(),
               model.points.size(), model.length_unit, model.metres_per_unit, model.diagnostics.size());
  return model;
}

void configure(STEPCAFControl_Reader& reader) {
  detail::route_occt_messages_to_spdlog();
  STEPCAFControl_Controller::Init();
  // XDE gives the names of products and instances (the assembly tree). Layers
  // and colours are read from the entity graph (StepAttributes), which also
  // reaches items XDE's labels do not; asking XDE for them as well would only
  // label every edge a second time.
  reader.SetNameMode(Standard_True);
  reader.SetLayerMode(Standard_False);
  reader.SetColorMode(Standard_False);
  reader.SetPropsMode(Standard_False);
  reader.SetGDTMode(Standard_False);
  reader.SetMatMode(Standard_False);
  reader.SetViewMode(Standard_False);
}

// After a parse: nothing to put back.
bool nothing_cut(STEPCAFControl_Reader&) { return true; }

// Parses with OCCT (`read` calls the reader's ReadFile or ReadStream, or parse_unlinked), has `restore`
// put back what was cut from the text (nothing when that fails: see restore_long_lists) and reads the
// parsed model; an unparsable input is a StepReadError naming `source`.
template <class Read, class Restore>
std::optional<StepModel> parse_and_read_with_occt(const std::string& source, Read read, Restore restore) {
  const std::lock_guard<std::mutex> one_at_a_time(detail::occt_exchange_lock());
  detail::route_occt_messages_to_spdlog();
  STEPCAFControl_Controller::Init();
  STEPCAFControl_Reader reader;
  configure(reader);
  IFSelect_ReturnStatus read_status = IFSelect_RetFail;
  detail::OcctFailureLog parser_log;
  try {
    read_status = read(reader);
  } catch (const Standard_Failure& failure) {
    fail(source, fmt::format("OCCT failed while parsing it ({}). {}", failure.GetMessageString(), export_advice));
  }
  if (read_status != IFSelect_RetDone) {
    const std::string said = parser_log.summary();
    fail(source, fmt::format("is not a readable STEP (ISO 10303-21) file: OCCT could not parse it{}. {}",
                             said.empty() ? std::string() : " (" + said + ")", export_advice));
  }
  if (!restore(reader)) return std::nullopt;
  return read_parsed(reader, source);
}

// As parse_and_read_with_occt, then gives the heap OCCT's reader freed back to the system: its
// many small objects leave the heap fragmented, and glibc keeps what lies below the top of the
// heap (the 100k bench frame: 370 MiB of a 720 MiB resident set after the read), so the
// factorisation that follows would add its gigabytes on top of it.
template <class Read, class Restore = decltype(&nothing_cut)>
std::optional<StepModel> parse_and_read(const std::string& source, Read read, Restore restore = &nothing_cut) {
  std::optional<StepModel> model = parse_and_read_with_occt(source, read, restore);
#if defined(__GLIBC__)
  malloc_trim(0);
#endif
  return model;
}

// Parses the text through OCCT's stream reader, rewritten first where OCCT
// would mis-read it or read it slowly: long lists of references cut (and put
// back after the parse), doubled quotes encoded, strings longer than OCCT
// takes cut (`long_strings`, each with a warning), shell-based wireframes
// rewritten.
// `rewrites.long_lists` holds only lists restore_long_lists puts back (restorable_long_lists).
StepModel read_text(std::string_view text, const std::string& source, const StepRewrites& rewrites) {
  const std::vector<StepLongList>& lists = rewrites.long_lists;
  auto parse = [&](std::string_view given, const std::vector<StepLongList>& cut) {
    const std::optional<std::string> quotes = detail::encode_doubled_quotes(given);
    if (quotes) given = *quotes;
    const std::optional<std::string> shortened =
        rewrites.long_strings.empty() ? std::nullopt : detail::shorten_long_strings(given, max_step_token);
    if (shortened) given = *shortened;
    const std::optional<std::string> rewritten = detail::rewrite_shell_wireframes(given);
    TextStream stream(rewritten ? std::string_view(*rewritten) : given);
    if (cut.empty())
      return parse_and_read(source, [&](STEPCAFControl_Reader& reader) {
        return reader.ChangeReader().ReadStream(source.c_str(), stream);
      });
    Handle(StepData_StepModel) parsed;
    return parse_and_read(
        source,
        [&](STEPCAFControl_Reader& reader) { return detail::parse_unlinked(reader, source.c_str(), stream, parsed); },
        [&](STEPCAFControl_Reader& reader) { return detail::restore_long_lists(reader, parsed, source.c_str(), cut); });
  };
  std::optional<StepModel> model = lists.empty() ? std::nullopt : parse(detail::cut_long_lists(text, lists), lists);
  if (!model) model = parse(text, {});
  for (const StepLongString& s : rewrites.long_strings) {
    const std::string where = s.entity != 0 ? fmt::format("a string of #{} (line {})", s.entity, s.line)
                                            : fmt::format("a string of the header (line {})", s.line);
    std::string message = fmt::format(
        "{}: {} is {} characters long, more than OCCT's STEP reader takes; only its first {} characters were "
        "read, followed by '...'",
        source, where, s.length, max_step_token - 3);
    spdlog::warn("{}", message);
    model->diagnostics.push_back({Severity::warning, "step-string-shortened", std::move(message),
                                  s.entity != 0 ? std::vector<std::string>{fmt::format("#{}", s.entity)}
                                                : std::vector<std::string>{},
                                  std::nullopt});
  }
  return std::move(*model);
}

// read_text after the structure check of the whole text (which throws for a broken one).
StepModel read_checked_text(std::string_view text, const std::string& source, std::size_t long_list) {
  StepRewrites rewrites = check_step_structure(text, source, long_list);
  rewrites.long_lists = detail::restorable_long_lists(std::move(rewrites.long_lists));
  return read_text(text, source, rewrites);
}

// What scan_file found: whether OCCT must be given rewritten text (the file
// mentions a shell-based wireframe, a string holds a doubled quote or is
// longer than OCCT takes, a list of references is long) and what to rewrite.
struct FileScan {
  bool other_rewrites = false;  // anything to rewrite but long lists
  StepRewrites rewrites;

  bool rewrite() const { return other_rewrites || !rewrites.long_lists.empty(); }
};

// One pass over the file in blocks: checks its exchange structure before OCCT
// sees it (StepStructureCheck) and tells whether OCCT must be given rewritten
// text. No copy of a large file is held.
FileScan scan_file(const std::filesystem::path& file, const std::string& source, std::size_t long_list) {
  errno = 0;
  std::ifstream in(file, std::ios::binary);
  if (!in)
    fail(source, fmt::format("cannot be read ({}); check its permissions", std::strerror(errno != 0 ? errno : EIO)));
  StepStructureCheck structure(source, long_list);
  // Below glibc's initial mmap threshold (128 KiB): freeing a larger block
  // raises the threshold for the rest of the process (mallopt(3), "dynamic
  // mmap threshold"), which measurably slows OCCT's parse that follows.
  constexpr std::size_t block = 1 << 16;
  constexpr std::size_t overlap = 32;  // longer than the keyword
  std::string buffer(block + overlap, '\0');
  std::size_t kept = 0;
  bool mentions = false;
  while (in) {
    in.read(buffer.data() + kept, static_cast<std::streamsize>(block));
    const auto got = static_cast<std::size_t>(in.gcount());
    structure.feed(std::string_view(buffer.data() + kept, got));
    mentions = mentions || detail::mentions_shell_wireframes(std::string_view(buffer.data(), kept + got));
    if (kept + got >= overlap) {
      std::copy(buffer.begin() + static_cast<std::ptrdiff_t>(kept + got - overlap),
                buffer.begin() + static_cast<std::ptrdiff_t>(kept + got), buffer.begin());
      kept = overlap;
    }
  }
  if (in.bad()) fail(source, "could not be read to its end; check the file");
  structure.finish();
  StepRewrites rewrites{structure.long_strings(), detail::restorable_long_lists(structure.long_lists())};
  return {mentions || structure.doubled_quotes() || !rewrites.long_strings.empty(), std::move(rewrites)};
}

}  // namespace

StepModel read_step(const std::filesystem::path& file) { return read_step(file, StepReadOptions{}); }

StepModel read_step(const std::filesystem::path& file, std::size_t long_list) {
  StepReadOptions options;
  options.long_list = long_list;
  return read_step(file, options);
}

StepModel read_step(const std::filesystem::path& file, const StepReadOptions& options) {
  const std::string source = file.string();
  std::error_code status_error;
  const auto status = std::filesystem::status(file, status_error);
  if (!std::filesystem::exists(status))
    fail(source, "file not found. Check the path and the file name (.stp or .step).");
  if (!std::filesystem::is_regular_file(status))
    fail(source, "is not a regular file (a folder?). Give the path of a STEP file.");
  spdlog::info("reading STEP file {}", source);

  const FileScan scan = scan_file(file, source, options.long_list);
  // Every large wireframe has long lists (its representation's items); a small file is read whole.
  if (options.two_processes_from != 0 && !scan.other_rewrites && !scan.rewrites.long_lists.empty()) {
    const std::string text = file_text(file, source);
    const auto read_part = [&](std::string_view part) { return read_checked_text(part, source, options.long_list); };
    if (std::optional<StepModel> model = detail::read_in_two_processes(text, options.two_processes_from, read_part))
      return std::move(*model);
    return read_text(text, source, scan.rewrites);
  }
  if (scan.rewrite()) return read_text(file_text(file, source), source, scan.rewrites);

  return *parse_and_read(source, [&](STEPCAFControl_Reader& reader) { return reader.ReadFile(source.c_str()); });
}

StepModel read_step_text(std::string_view step_text, std::string display_name) {
  if (display_name.empty()) display_name = "<STEP text>";
  spdlog::info("reading STEP text {}", display_name);
  if (step_text.find("ISO-10303-21") == std::string_view::npos)
    fail(display_name, fmt::format("is not STEP (ISO 10303-21) text: it does not start with ISO-10303-21;. {}",
                                   export_advice));
  return read_checked_text(step_text, display_name, long_step_list);
}

}  // namespace stepframe::geometry
