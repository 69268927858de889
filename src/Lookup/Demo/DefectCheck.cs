using Lookup.Sweeps;

namespace Lookup.Demo;

/// <summary>
/// Decides whether a sweep report shows a planted mistake. Each kind of mistake has the finding kind a catalogue owner
/// would act on: a photo under two SKUs must be in one "same photo under several SKUs" finding; a re-export must be
/// grouped with its original as copies (inside one SKU, or in a same-photo finding that also spans other SKUs); a
/// wrong part must be the flagged photo of a "far from its SKU" finding. A finding that merely lists the photo
/// among look-alikes does not count.
/// </summary>
internal static class DefectCheck
{
    /// <param name="defect">The planted mistake (paths relative to the demo folder).</param>
    /// <param name="report">The sweep report (paths relative to the ingested catalogue root).</param>
    /// <param name="toIndexPath">Turns a demo-folder path into the path the sweep reports.</param>
    public static DefectOutcome Check(DemoDefect defect, SweepReport report, Func<string, string> toIndexPath)
    {
        ArgumentNullException.ThrowIfNull(defect);
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(toIndexPath);
        var files = defect.Files.Select(toIndexPath).ToList();
        for (var i = 0; i < report.Findings.Count; i++)
        {
            if (Shows(defect.Kind, files, report.Findings[i]))
            {
                return new DefectOutcome(defect, report.Findings[i], i + 1);
            }
        }

        return new DefectOutcome(defect, null, null);
    }

    private static bool Shows(string kind, List<string> files, SweepFinding finding)
    {
        bool Lists(string file) => finding.Members.Any(m => m.Path == file);
        return kind switch
        {
            DemoDefect.SamePhotoTwoSkus => finding.Kind == FindingKind.SamePhotoSeveralSkus && files.All(Lists),
            DemoDefect.ReExportWithinSku =>
                finding.Kind is FindingKind.CopiesInOneSku or FindingKind.SamePhotoSeveralSkus && files.All(Lists),
            DemoDefect.WrongPart => finding.Kind == FindingKind.FarFromItsSku
                && finding.Members.Any(m => m.Role == MemberRole.Flagged && files.Contains(m.Path)),
            _ => false,
        };
    }
}
