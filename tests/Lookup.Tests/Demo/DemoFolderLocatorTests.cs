using Lookup.Demo;

namespace Lookup.Tests.Demo;

/// <summary>Finding the demo folder from the current folder or the program's folder without being told.</summary>
public sealed class DemoFolderLocatorTests
{
    [Fact]
    public void The_committed_demo_folder_is_found_from_a_folder_deep_inside_the_repository()
    {
        var deep = Path.Combine(Path.GetDirectoryName(DemoFolder.Root)!, "src", "Lookup", "Demo");

        Assert.Equal(DemoFolder.Root, DemoFolderLocator.Find([deep]));
    }

    [Fact]
    public void A_folder_named_like_the_demo_without_its_truth_file_is_passed_over()
    {
        var root = Directory.CreateTempSubdirectory("lookup-locator-").FullName;
        try
        {
            Directory.CreateDirectory(Path.Combine(root, DemoFolderLocator.FolderName, DemoTruth.PhotosFolder));
            var start = Directory.CreateDirectory(Path.Combine(root, "a", "b")).FullName;

            var found = DemoFolderLocator.Find([start]);

            Assert.True(found is null || !found.StartsWith(root, StringComparison.Ordinal), found);
        }
        finally
        {
            Directory.Delete(root, recursive: true);
        }
    }
}
