using Lookup.Catalogue;
using static Lookup.Tests.Catalogue.MergeTestParts;

namespace Lookup.Tests.Catalogue;

/// <summary>Which version of a path a merge keeps (<see cref="MergeRules"/>).</summary>
public sealed class MergeRulesTests
{
    private static readonly DateTime Day2 = Day1.AddDays(1);

    [Fact]
    public void Decide_adds_a_path_the_target_does_not_know() =>
        Assert.Equal(MergeStepKind.Add, MergeRules.Decide(Photo(1, Day1).Record, null));

    [Fact]
    public void Decide_leaves_a_record_equal_but_for_its_node_id_unchanged()
    {
        var part = Photo(1, Day1).Record with { NodeId = 4 };
        var target = Photo(1, Day1).Record with { NodeId = 912 };

        Assert.Equal(MergeStepKind.Unchanged, MergeRules.Decide(part, target));
    }

    [Fact]
    public void Decide_sees_a_different_thumbnail_as_a_different_record()
    {
        var part = Photo(1, Day2).Record with { NodeId = 4 };
        var target = part with { Thumbnail = [1, 2, 3] };

        Assert.Equal(MergeStepKind.Update, MergeRules.Decide(part, target));
    }

    [Fact]
    public void Decide_updates_the_record_but_keeps_the_node_when_only_the_sku_changed()
    {
        var target = Photo(1, Day1).Record with { NodeId = 3 };
        var part = target with { Sku = "SKU-NEW", UpdatedUtc = Day2, NodeId = 0 };

        Assert.Equal(MergeStepKind.Update, MergeRules.Decide(part, target));
    }

    [Fact]
    public void Decide_replaces_newer_different_content_and_ignores_older_content()
    {
        var old = Photo(1, Day1).Record with { NodeId = 3 };
        var changed = Photo(1, Day2, contentVersion: 1).Record with { NodeId = 0 };

        Assert.Equal(MergeStepKind.Replace, MergeRules.Decide(changed, old));
        Assert.Equal(MergeStepKind.Superseded, MergeRules.Decide(old, changed));
    }

    [Fact]
    public void Supersedes_prefers_an_embedding_of_the_same_bytes_over_a_failure_of_any_age()
    {
        var indexed = Photo(1, Day1).Record;
        var failed = Failed(1, Day2).Record;

        Assert.True(MergeRules.Supersedes(indexed, failed));
        Assert.False(MergeRules.Supersedes(failed, indexed));
    }

    [Fact]
    public void Supersedes_gives_a_tie_to_the_incoming_record()
    {
        var a = Photo(1, Day1, contentVersion: 0).Record;
        var b = Photo(1, Day1, contentVersion: 1).Record;

        Assert.True(MergeRules.Supersedes(b, a));
        Assert.True(MergeRules.Supersedes(a, b));
    }

    [Fact]
    public void SameContent_needs_a_known_hash_on_both_sides()
    {
        var unread = Failed(1, Day1).Record with { Sha256 = null };

        Assert.False(MergeRules.SameContent(unread, unread));
        Assert.True(MergeRules.SameContent(Photo(1, Day1).Record, Failed(1, Day2).Record));
    }
}
