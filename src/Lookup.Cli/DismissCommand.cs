using System.CommandLine;
using System.Text.Json;
using Lookup.Store;
using Lookup.Sweeps;

namespace Lookup.Cli;

/// <summary><c>lookup dismiss --index FILE KEY | --pair PATH PATH | --from FILE | --list | --undo KEY</c>: record, show or
/// take back "not a duplicate".</summary>
internal static class DismissCommand
{
    public static Command Create()
    {
        var index = IndexOption.Create();
        var keys = new Argument<string[]>("key")
        {
            Description = "Finding or pair keys from a sweep's table, CSV or JSON (a unique prefix of at least 8 hex digits is enough).",
            Arity = ArgumentArity.ZeroOrMore,
        };
        var pair = new Option<string[]>("--pair")
        {
            Description = "Two photos (paths relative to the catalogue root) that are not duplicates of each other.",
            Arity = new ArgumentArity(2, 2),
            AllowMultipleArgumentsPerToken = true,
        };
        var from = new Option<string?>("--from")
        {
            Description = "A CSV of decisions: finding_key (or key), or first_path and second_path; optional note, reviewer, decision columns. A sweep's own --csv file works.",
        };
        var note = new Option<string>("--note") { Description = "Why, in your words (stored with the decision).", DefaultValueFactory = _ => "" };
        var reviewer = new Option<string>("--reviewer")
        {
            Description = "Who decides (default: the login name).",
            DefaultValueFactory = _ => Environment.UserName,
        };
        var json = new Option<bool>("--json") { Description = "Print the outcome of each decision as JSON." };
        var list = new Option<bool>("--list") { Description = "Show the decisions recorded in the index (key, finding or pair, who, when, photos, note) and record nothing." };
        var undo = new Option<string?>("--undo")
        {
            Description = "Take back the decision with this key (from --list; a unique prefix of at least 8 hex digits). A finding's pair decisions go with it.",
        };
        var command = new Command(
            "dismiss",
            """
            Record that a finding, or two photos, are not duplicates. Later sweeps never report them again; the decision
            rests on the files' content, so renaming or moving the photos keeps it. A dismissed group comes back only
            with a new photo's pairs. Needs the index to itself for a moment: it fails while an ingest is writing.

            Example:
              lookup dismiss --index parts.lookup 3f9a2c1b7d0e --note "left and right hand parts"
              lookup dismiss --index parts.lookup --pair 4471-B/front.jpg 4471-C/front.jpg
              lookup dismiss --index parts.lookup --from reviewed.csv
              lookup dismiss --index parts.lookup --list
              lookup dismiss --index parts.lookup --undo 3f9a2c1b7d0e

            Exit codes: 0 all recorded (or already recorded, or listed, or taken back), 1 some key or path not found or the
            index busy, 2 usage error.
            """)
        {
            index, keys, pair, from, note, reviewer, json, list, undo,
        };
        command.SetAction(parseResult => parseResult.GetValue(list) || parseResult.GetValue(undo) is not null
            ? Review(
                parseResult.GetValue(index)!,
                parseResult.GetValue(list),
                parseResult.GetValue(undo),
                (parseResult.GetValue(keys) ?? []).Length > 0 || parseResult.GetValue(pair) is { Length: > 0 } || parseResult.GetValue(from) is not null,
                parseResult.GetValue(json),
                parseResult.InvocationConfiguration.Output,
                parseResult.InvocationConfiguration.Error)
            : Run(
            parseResult.GetValue(index)!,
            parseResult.GetValue(keys) ?? [],
            parseResult.GetValue(pair),
            parseResult.GetValue(from),
            parseResult.GetValue(note)!,
            parseResult.GetValue(reviewer)!,
            parseResult.GetValue(json),
            parseResult.InvocationConfiguration.Output,
            parseResult.InvocationConfiguration.Error));
        return command;
    }

    private static int Run(
        string indexPath, string[] keys, string[]? pair, string? from, string note, string reviewer, bool json, TextWriter output, TextWriter error)
    {
        if (keys.Length == 0 && pair is not { Length: > 0 } && from is null)
        {
            error.WriteLine("lookup dismiss: give a finding key, --pair PATH PATH, or --from FILE.");
            return ExitCodes.Usage;
        }

        if (string.IsNullOrWhiteSpace(reviewer))
        {
            error.WriteLine("lookup dismiss: --reviewer must name someone.");
            return ExitCodes.Usage;
        }

        var requests = keys.Select(k => DismissRequest.ForKey(k, note)).ToList();
        if (pair is { Length: 2 })
        {
            requests.Add(DismissRequest.ForPair(pair[0], pair[1], note));
        }

        var problems = new List<string>();
        if (from is not null)
        {
            try
            {
                var (fromCsv, csvProblems, _) = DecisionCsv.Read(from);
                requests.AddRange(fromCsv.Select(r => r.Note.Length == 0 && note.Length > 0 ? r with { Note = note } : r));
                problems.AddRange(csvProblems);
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                error.WriteLine($"lookup dismiss: {from} could not be read: {e.Message}");
                return ExitCodes.Failures;
            }
        }

        if (!File.Exists(indexPath))
        {
            error.WriteLine($"lookup dismiss: {Path.GetFullPath(indexPath)} does not exist: check the --index path.");
            return ExitCodes.Failures;
        }

        IReadOnlyList<DismissOutcome> outcomes;
        try
        {
            using var file = IndexFile.Open(indexPath, IndexAccess.Write);
            outcomes = Dismissals.Apply(file, requests, reviewer, Environment.CurrentDirectory);
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup dismiss: {e.Message}");
            return ExitCodes.Failures;
        }

        if (json)
        {
            output.WriteLine(JsonSerializer.Serialize(
                new
                {
                    index = indexPath,
                    decisions = outcomes.Select(o => new
                    {
                        request = o.Request.ToString(),
                        source = o.Request.Source,
                        status = o.Status,
                        target = o.Target,
                        key = o.Key,
                        paths = o.Paths,
                        pairsDismissed = o.PairsDismissed,
                        message = o.Message,
                    }),
                    problems,
                },
                SweepJsonWriter.Options));
        }
        else
        {
            foreach (var outcome in outcomes)
            {
                var source = outcome.Request.Source == "command" ? "" : $"{outcome.Request.Source}: ";
                output.WriteLine($"{Status(outcome.Status),-9}  {source}{outcome.Message}");
            }

            foreach (var problem in problems)
            {
                output.WriteLine($"{"skipped",-9}  {problem}");
            }

            output.WriteLine(Verdicts.SafetyNotice);
        }

        return outcomes.Any(o => o.Failed) || problems.Count > 0 ? ExitCodes.Failures : ExitCodes.Success;
    }

    /// <summary>--list or --undo: show the decisions, or take one back.</summary>
    private static int Review(string indexPath, bool list, string? undo, bool recordsToo, bool json, TextWriter output, TextWriter error)
    {
        if (recordsToo || (list && undo is not null))
        {
            error.WriteLine("lookup dismiss: --list and --undo each go alone (no keys, --pair or --from with them, nor both together).");
            return ExitCodes.Usage;
        }

        if (!File.Exists(indexPath))
        {
            error.WriteLine($"lookup dismiss: {Path.GetFullPath(indexPath)} does not exist: check the --index path.");
            return ExitCodes.Failures;
        }

        try
        {
            if (list)
            {
                using var reader = IndexFile.Open(indexPath, IndexAccess.Read);
                WriteList(new DecisionStore(reader).All(), indexPath, json, output);
                return ExitCodes.Success;
            }

            using var file = IndexFile.Open(indexPath, IndexAccess.Write);
            var outcome = DecisionUndo.Undo(file, undo!);
            if (json)
            {
                output.WriteLine(JsonSerializer.Serialize(
                    new { index = indexPath, status = outcome.Status, decision = outcome.Decision, pairsRestored = outcome.PairsRestored, message = outcome.Message },
                    SweepJsonWriter.Options));
            }
            else
            {
                output.WriteLine(outcome.Message);
            }

            return outcome.Status == UndoStatus.Undone ? ExitCodes.Success : ExitCodes.Failures;
        }
        catch (IndexFileException e)
        {
            error.WriteLine($"lookup dismiss: {e.Message}");
            return ExitCodes.Failures;
        }
    }

    private static void WriteList(IReadOnlyList<ReviewerDecision> decisions, string indexPath, bool json, TextWriter output)
    {
        if (json)
        {
            output.WriteLine(JsonSerializer.Serialize(new { index = indexPath, decisions }, SweepJsonWriter.Options));
            return;
        }

        if (decisions.Count == 0)
        {
            output.WriteLine($"{indexPath} holds no decisions.");
            return;
        }

        // Pair decisions recorded with a finding's decision are counted under it, not listed one by one.
        var withFinding = decisions.Where(d => d.ViaFinding is not null).GroupBy(d => d.ViaFinding!).ToDictionary(g => g.Key, g => g.Count());
        var shown = decisions.Where(d => d.ViaFinding is null || !decisions.Any(f => f.Key == d.ViaFinding)).ToList();
        var rows = shown.Select(d => new[]
        {
            d.Key[..Math.Min(12, d.Key.Length)],
            d.Target == DecisionTarget.Finding ? $"finding ({withFinding.GetValueOrDefault(d.Key)} pairs)" : "pair",
            d.Reviewer,
            d.DecidedUtc.ToString("yyyy-MM-dd HH:mm", System.Globalization.CultureInfo.InvariantCulture),
            string.Join(" / ", d.Paths.Take(3)) + (d.Paths.Count > 3 ? $" (+{d.Paths.Count - 3})" : ""),
            d.Note,
        }).ToList();
        string[] header = ["key", "what", "reviewer", "decided (UTC)", "photos", "note"];
        var widths = header.Select((h, i) => Math.Max(h.Length, rows.Max(r => r[i].Length))).ToArray();
        output.WriteLine(string.Join("  ", header.Select((h, i) => h.PadRight(widths[i]))).TrimEnd());
        output.WriteLine(string.Join("  ", widths.Select(w => new string('-', w))));
        foreach (var row in rows)
        {
            output.WriteLine(string.Join("  ", row.Select((c, i) => c.PadRight(widths[i]))).TrimEnd());
        }

        output.WriteLine($"{shown.Count} decisions. Take one back with lookup dismiss --index {indexPath} --undo KEY.");
    }

    private static string Status(DismissStatus status) => status switch
    {
        DismissStatus.Dismissed => "dismissed",
        DismissStatus.AlreadyDismissed => "unchanged",
        DismissStatus.Ambiguous => "ambiguous",
        _ => "not found",
    };
}
