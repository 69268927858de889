#!/usr/bin/env bash
# Re-extracts tests/reference-data/ from the Debian packages it was taken from (see tests/reference-data/SOURCES.md)
# and checks every file against tests/reference-data/SHA256SUMS.
#   opencv-doc       -> tests/reference-data/opencv/   (installed copy used if present, else the .deb is downloaded)
#   python3-skimage  -> tests/reference-data/skimage/  (the .deb is downloaded and unpacked, not installed)
#   generated        -> tests/reference-data/generated/chelsea-cmyk.jpg (needs ImageMagick's convert)
# Usage: tools/extract-reference-data.sh [--verify-only]
set -euo pipefail
cd "$(dirname "$0")/.."
out=tests/reference-data

# The opencv-doc sample photos used as the gallery: every .jpg/.png in examples/data except the numbered
# chessboard series (left01..right14) and the files left out for size (listed in SOURCES.md).
opencv_files=(
  aero1.jpg aero3.jpg aloeL.jpg aloeR.jpg apple.jpg baboon.jpg basketball1.png basketball2.png
  Blender_Suzanne1.jpg Blender_Suzanne2.jpg blox.jpg board.jpg box.png box_in_scene.png building.jpg
  butterfly.jpg cards.png detect_blob.png ela_modified.jpg ela_original.jpg fruits.jpg gradient.png
  graf1.png graf3.png HappyFish.jpg home.jpg imageTextN.png imageTextR.png left.jpg leuvenA.jpg leuvenB.jpg
  licenseplate_motion.jpg LinuxLogo.jpg mask.png messi5.jpg ml.png notes.png opencv-logo.png
  opencv-logo-white.png orange.jpg pca_test1.jpg pic1.png pic3.png pic5.png pic6.png right.jpg
  rubberwhale1.png rubberwhale2.png smarties.png squirrel_cls.jpg stuff.jpg sudoku.png templ.png text_defocus.jpg
  text_motion.jpg tmpl.png WindowsLogo.jpg
)
skimage_files=(
  astronaut.png coffee.png chelsea.png rocket.jpg motorcycle_left.png camera.png coins.png clock_motion.png
  palette_color.png palette_gray.png no_time_for_that_tiny.gif multipage_rgb.tif chessboard_GRAY_U16.tif
  chessboard_GRAY_U16B.tif truncated.jpg
)

if [ "${1:-}" != "--verify-only" ]; then
  work=$(mktemp -d)
  trap 'rm -rf "$work"' EXIT
  chmod a+rwx "$work"  # apt-get download runs as _apt when it can

  opencv_dir=/usr/share/doc/opencv-doc/examples/data
  if [ ! -d "$opencv_dir" ]; then
    (cd "$work" && apt-get download opencv-doc >/dev/null)
    dpkg-deb -x "$work"/opencv-doc_*.deb "$work/opencv"
    opencv_dir="$work/opencv/usr/share/doc/opencv-doc/examples/data"
  fi
  mkdir -p "$out/opencv"
  for f in "${opencv_files[@]}"; do cp "$opencv_dir/$f" "$out/opencv/$f"; done

  (cd "$work" && apt-get download python3-skimage >/dev/null)
  dpkg-deb -x "$work"/python3-skimage_*.deb "$work/skimage"
  skimage_dir="$work/skimage/usr/lib/python3/dist-packages/skimage/data"
  mkdir -p "$out/skimage"
  for f in "${skimage_files[@]}"; do cp "$skimage_dir/$f" "$out/skimage/$f"; done

  # A CMYK JPEG (Adobe APP14, inverted CMYK as Photoshop writes it) made from chelsea.png: no Debian package
  # found ships one. The bytes depend on the ImageMagick version, so only the pixels are compared in tests.
  if convert -version 2>/dev/null | grep -q ImageMagick; then
    mkdir -p "$out/generated"
    convert "$out/skimage/chelsea.png" -strip -colorspace CMYK -quality 92 "$out/generated/chelsea-cmyk.jpg"
  else
    echo "ImageMagick not installed: kept the committed generated/chelsea-cmyk.jpg (apt-get install imagemagick to remake it)" >&2
  fi
fi

(cd "$out" && sha256sum --quiet -c SHA256SUMS) && echo "reference data verified: $(wc -l < "$out/SHA256SUMS") files"
