// Report pictures rendered by VTK with OpenGL in an offscreen EGL context.
//
// Debian's VTK 9.1 is built for X (GLX) only, so a window-system-free context
// is made here with EGL on Mesa's surfaceless platform and handed to VTK's
// generic OpenGL render window, which renders into its own framebuffer
// object. GLEW's GLX half cannot start without an X display: glewInit loads
// every OpenGL entry point first and only then fails on GLX with
// GLEW_ERROR_NO_GLX_DISPLAY, which the window below accepts.

#include "picture_scene.hpp"
#include "png_bytes.hpp"
#include "stepframe/viz/picture.hpp"

// GLEW before any other OpenGL header.
#include <GL/glew.h>
//
#include <EGL/egl.h>
#include <Eigen/Geometry>
#include <EGL/eglext.h>
#include <vtkActor.h>
#include <vtkAutoInit.h>
#include <vtkCamera.h>
#include <vtkCellArray.h>
#include <vtkGenericOpenGLRenderWindow.h>
#include <vtkNew.h>
#include <vtkObjectFactory.h>
#include <vtkPointData.h>
#include <vtkPoints.h>
#include <vtkPolyData.h>
#include <vtkPolyDataMapper.h>
#include <vtkProperty.h>
#include <vtkUnsignedCharArray.h>
#include <vtkRenderer.h>
#include <vtkWindowToImageFilter.h>

#include <exception>
#include <memory>
#include <thread>

VTK_MODULE_INIT(vtkRenderingOpenGL2);

namespace stepframe::viz::detail {
namespace {

/// A surfaceless EGL context. Current on no thread until `make_current`; a
/// thread that made it current releases it before another thread takes it.
class OffscreenContext {
 public:
  /// Throws std::runtime_error saying what is missing.
  OffscreenContext() {
    auto platform_display =
        reinterpret_cast<PFNEGLGETPLATFORMDISPLAYEXTPROC>(eglGetProcAddress("eglGetPlatformDisplayEXT"));
    if (!platform_display) throw std::runtime_error("EGL has no eglGetPlatformDisplayEXT");
    display_ = platform_display(EGL_PLATFORM_SURFACELESS_MESA, EGL_DEFAULT_DISPLAY, nullptr);
    EGLint major = 0, minor = 0;
    if (display_ == EGL_NO_DISPLAY || !eglInitialize(display_, &major, &minor))
      throw std::runtime_error("no surfaceless EGL display (Mesa's EGL and DRI drivers are needed)");
    if (!eglBindAPI(EGL_OPENGL_API)) throw std::runtime_error("EGL cannot bind desktop OpenGL");
    // VTK needs OpenGL 3.2 core.
    const EGLint attributes[] = {EGL_CONTEXT_MAJOR_VERSION, 3, EGL_CONTEXT_MINOR_VERSION, 2,
                                 EGL_CONTEXT_OPENGL_PROFILE_MASK, EGL_CONTEXT_OPENGL_CORE_PROFILE_BIT, EGL_NONE};
    context_ = eglCreateContext(display_, EGL_NO_CONFIG_KHR, EGL_NO_CONTEXT, attributes);
    if (context_ == EGL_NO_CONTEXT) throw std::runtime_error("EGL cannot create an OpenGL 3.2 core context");
  }
  ~OffscreenContext() {
    // The display stays initialised: terminating it would end any other user's contexts on it.
    eglDestroyContext(display_, context_);
  }
  OffscreenContext(const OffscreenContext&) = delete;
  OffscreenContext& operator=(const OffscreenContext&) = delete;

  /// Current on the calling thread while the returned guard lives.
  [[nodiscard]] auto make_current() const {
    if (!eglBindAPI(EGL_OPENGL_API) || !eglMakeCurrent(display_, EGL_NO_SURFACE, EGL_NO_SURFACE, context_))
      throw std::runtime_error("EGL cannot make the context current without a surface");
    auto release = [display = display_](const OffscreenContext*) {
      eglMakeCurrent(display, EGL_NO_SURFACE, EGL_NO_SURFACE, EGL_NO_CONTEXT);
    };
    return std::unique_ptr<const OffscreenContext, decltype(release)>(this, release);
  }

 private:
  EGLDisplay display_ = EGL_NO_DISPLAY;
  EGLContext context_ = EGL_NO_CONTEXT;
};

/// VTK's generic render window on the current context, with OpenGL entry points loaded without GLX.
class ContextWindow : public vtkGenericOpenGLRenderWindow {
 public:
  static ContextWindow* New();
  vtkTypeMacro(ContextWindow, vtkGenericOpenGLRenderWindow)

 protected:
  void OpenGLInitContext() override {
    if (!this->Initialized) {
      glewExperimental = GL_TRUE;
      const GLenum loaded = glewInit();
      if (loaded != GLEW_OK && loaded != GLEW_ERROR_NO_GLX_DISPLAY) {
        vtkErrorMacro("GLEW could not load the OpenGL entry points");
        return;
      }
      if (!GLEW_VERSION_3_2) {
        vtkErrorMacro("the offscreen context does not offer OpenGL 3.2");
        return;
      }
      // What the base class does after glewInit: the line width range the hardware draws.
      GLfloat range[2] = {1, 1};
      glGetFloatv(GL_ALIASED_LINE_WIDTH_RANGE, range);
      this->MaximumHardwareLineWidth = glGetError() == GL_NO_ERROR ? range[1] : 1.0f;
      this->Initialized = true;  // the base class skips its glewInit (whose GLX half needs an X display)
    }
    vtkGenericOpenGLRenderWindow::OpenGLInitContext();
  }
};
vtkStandardNewMacro(ContextWindow);

/// The polylines as VTK poly data with their colours as direct RGB scalars.
vtkSmartPointer<vtkPolyData> polylines(const std::vector<ScenePolyline>& lines) {
  vtkNew<vtkPoints> points;
  points->SetDataTypeToDouble();
  vtkNew<vtkCellArray> cells;
  vtkNew<vtkUnsignedCharArray> colours;
  colours->SetNumberOfComponents(3);
  for (const auto& line : lines) {
    cells->InsertNextCell(static_cast<int>(line.size()));
    for (const auto& p : line) {
      cells->InsertCellPoint(points->InsertNextPoint(p.position.data()));
      colours->InsertNextTypedTuple(p.colour.data());
    }
  }
  auto data = vtkSmartPointer<vtkPolyData>::New();
  data->SetPoints(points);
  data->SetLines(cells);
  data->GetPointData()->SetScalars(colours);
  return data;
}

/// One scene into `window` (the context current, the window reused from the scene before, so that
/// the shader programs VTK compiled for it are used again: compiling them is most of a first render).
DrawnScene render(ContextWindow& window, const PictureScene& scene) {
  window.SetSize(scene.width, scene.height);

  vtkNew<vtkRenderer> renderer;
  renderer->SetBackground(1, 1, 1);
  // Members are drawn cased: a dark line under each coloured one (a layer of its own below), so
  // the palest colours of the scale still show on white.
  vtkNew<vtkRenderer> casing;
  casing->SetBackground(1, 1, 1);
  window.SetNumberOfLayers(2);
  casing->SetLayer(0);
  renderer->SetLayer(1);
  renderer->SetBackgroundAlpha(0);
  window.AddRenderer(renderer);
  window.AddRenderer(casing);
  auto add_lines = [&](vtkRenderer* target, const std::vector<ScenePolyline>& lines, float width, const Rgb* single) {
    if (lines.empty()) return;
    vtkNew<vtkPolyDataMapper> mapper;
    mapper->SetInputData(polylines(lines));
    mapper->SetColorModeToDirectScalars();  // our colours as they are, no lookup table
    mapper->SetScalarVisibility(single == nullptr);
    vtkNew<vtkActor> actor;
    actor->SetMapper(mapper);
    actor->GetProperty()->LightingOff();  // flat colours: the scale reads the same everywhere
    actor->GetProperty()->SetLineWidth(width);
    if (single) actor->GetProperty()->SetColor((*single)[0] / 255.0, (*single)[1] / 255.0, (*single)[2] / 255.0);
    target->AddActor(actor);
  };
  add_lines(renderer, scene.grey, 1.5f, nullptr);
  add_lines(renderer, scene.coloured, 4.0f, nullptr);
  add_lines(casing, scene.coloured, 6.5f, &casing_colour);

  // The view of the canvas pictures: orthographic, from above the (+X, -Y) corner.
  vtkCamera* camera = renderer->GetActiveCamera();
  camera->ParallelProjectionOn();
  camera->SetFocalPoint(0, 0, 0);
  camera->SetPosition(view_right.cross(view_up).data());
  camera->SetViewUp(view_up.data());
  renderer->ResetCamera();
  camera->Zoom(0.95);
  casing->SetActiveCamera(camera);

  window.Render();
  vtkNew<vtkWindowToImageFilter> grab;
  grab->SetInput(&window);
  grab->SetInputBufferTypeToRGB();
  grab->ReadFrontBufferOff();
  grab->Update();
  if (glGetError() != GL_NO_ERROR) throw std::runtime_error("OpenGL reported an error while rendering");
  DrawnScene drawn{png_bytes(grab->GetOutput()), {}};
  for (const auto& anchor : scene.anchors) {
    renderer->SetWorldPoint(anchor.x(), anchor.y(), anchor.z(), 1.0);
    renderer->WorldToDisplay();
    const double* display = renderer->GetDisplayPoint();  // pixels from the bottom-left corner
    drawn.anchors.push_back({display[0], scene.height - display[1]});
  }
  // The renderers go (their OpenGL resources released while the context is current); the window, and the
  // shader programs it keeps, serve the next scene.
  window.RemoveRenderer(renderer);
  window.RemoveRenderer(casing);
  return drawn;
}

/// Runs `work` on a thread of its own and waits for it: that thread's OpenGL "current context" is its
/// own, whatever the caller's thread has current. Exceptions come back to the caller.
template <class Work>
void on_own_thread(Work&& work) {
  std::exception_ptr failure;
  std::thread worker([&] {
    try {
      work();
    } catch (...) {
      failure = std::current_exception();
    }
  });
  worker.join();
  if (failure) std::rethrow_exception(failure);
}

}  // namespace

struct OffscreenPictures::Parts {
  OffscreenContext context;
  vtkSmartPointer<ContextWindow> window;
};

OffscreenPictures::OffscreenPictures() {
  on_own_thread([&] {
    auto parts = std::make_unique<Parts>();
    const auto current = parts->context.make_current();
    parts->window = vtkSmartPointer<ContextWindow>::New();
    ContextWindow& window = *parts->window;
    window.SetOwnContext(false);
    window.SetIsCurrent(true);
    window.SetReadyForRendering(true);
    window.SetOffScreenRendering(true);
    window.SetMultiSamples(0);
    window.SetFrameBlitModeToNoBlit();
    parts_ = std::move(parts);
  });
}

OffscreenPictures::~OffscreenPictures() {
  if (!parts_) return;
  // The window's OpenGL resources are released with its context current, before the context goes.
  on_own_thread([&] {
    try {
      const auto current = parts_->context.make_current();
      parts_->window = nullptr;
    } catch (const std::exception&) {  // the context cannot be had: its resources go with it below
    }
    parts_.reset();
  });
}

std::vector<DrawnScene> OffscreenPictures::draw(const std::vector<PictureScene>& scenes) {
  std::vector<DrawnScene> pictures;
  on_own_thread([&] {
    const auto current = parts_->context.make_current();
    for (const PictureScene& scene : scenes) pictures.push_back(render(*parts_->window, scene));
  });
  return pictures;
}

}  // namespace stepframe::viz::detail
