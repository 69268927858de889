namespace Lookup.Tests.Sweeps;

/// <summary>
/// The open photos under tests/reference-data (see its SOURCES.md): opencv-doc's sample data (Debian package
/// opencv-doc, examples/data) and scikit-image's data folder (Debian package python3-skimage).
/// </summary>
internal static class ReferencePhotos
{
    /// <summary>Photos the copies are planted on: varied subjects, sizes and aspect ratios, colour and grey.</summary>
    public static readonly string[] Sources =
    [
        "opencv/apple.jpg", "opencv/baboon.jpg", "opencv/fruits.jpg", "opencv/building.jpg", "opencv/messi5.jpg",
        "opencv/smarties.png", "opencv/board.jpg", "opencv/box.png", "skimage/astronaut.png", "skimage/coffee.png",
        "skimage/chelsea.png", "skimage/rocket.jpg",
    ];

    /// <summary>
    /// Genuinely different photos of one scene, playing the part of a catalogue's second views: graf1/graf3 (a wall
    /// seen from two angles), leuvenA/leuvenB (a street panorama pair), aloeL/aloeR and left/right (stereo pairs).
    /// </summary>
    public static readonly (string, string)[] SecondViews =
    [
        ("opencv/graf1.png", "opencv/graf3.png"),
        ("opencv/leuvenA.jpg", "opencv/leuvenB.jpg"),
        ("opencv/aloeL.jpg", "opencv/aloeR.jpg"),
        ("opencv/left.jpg", "opencv/right.jpg"),
    ];

    public static string PathOf(string relative) => Path.Combine(Root(), "tests", "reference-data", relative);

    private static string Root()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            if (File.Exists(Path.Combine(dir.FullName, "Lookup.sln")))
            {
                return dir.FullName;
            }
        }

        throw new DirectoryNotFoundException($"No Lookup.sln above {AppContext.BaseDirectory}: run the tests from the repository.");
    }
}
