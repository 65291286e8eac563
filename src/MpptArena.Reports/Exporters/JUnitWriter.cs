using System.Xml.Linq;

namespace MpptArena.Reports.Exporters;

/// <summary>Writes JUnit XML (the common testsuites/testsuite/testcase form CI systems read).</summary>
public static class JUnitWriter
{
    /// <summary>The XML document for the cases, one testsuite per suite name.</summary>
    public static XDocument Build(IEnumerable<JUnitCase> cases)
    {
        var suites = cases.GroupBy(c => c.Suite).Select(g => new XElement("testsuite",
            new XAttribute("name", g.Key),
            new XAttribute("tests", g.Count()),
            new XAttribute("failures", g.Count(c => c.Failure is not null)),
            new XAttribute("errors", 0),
            g.Select(c => new XElement("testcase",
                new XAttribute("classname", g.Key),
                new XAttribute("name", c.Name),
                c.Failure is null ? null : new XElement("failure", new XAttribute("message", c.Failure), c.Failure),
                new XElement("system-out", c.Output)))));
        var list = suites.ToList();
        return new XDocument(new XElement("testsuites",
            new XAttribute("tests", list.Sum(s => (int)s.Attribute("tests")!)),
            new XAttribute("failures", list.Sum(s => (int)s.Attribute("failures")!)),
            list));
    }

    /// <summary>
    /// Refuses, before any work, a report path that is empty, a folder, or an existing file that is not a
    /// JUnit report (a file the arena would not have written is never overwritten).
    /// </summary>
    public static void CheckTarget(string path, string option = "--junit")
    {
        if (string.IsNullOrWhiteSpace(path)) throw new ArenaInputException($"{option} needs a file name; it was empty", option);
        if (Directory.Exists(path)) throw new ArenaInputException($"{option} '{path}' is a folder; name a file such as {Path.Combine(path, "mppt-arena.xml")}", option);
        if (!File.Exists(path) || new FileInfo(path).Length == 0) return;
        bool isReport;
        try
        {
            using var reader = System.Xml.XmlReader.Create(path);
            isReport = reader.MoveToContent() == System.Xml.XmlNodeType.Element && reader.LocalName == "testsuites";
        }
        catch (System.Xml.XmlException)
        {
            isReport = false;
        }
        if (!isReport) throw new ArenaInputException($"{option} '{path}' exists and is not a JUnit report; it is not overwritten: name a new file", option);
    }

    /// <summary>Writes the cases to <paramref name="path"/> (a temporary file renamed into place).</summary>
    public static void Write(string path, IEnumerable<JUnitCase> cases)
    {
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(dir);
        string temp = Path.Combine(dir, $".{Path.GetFileName(full)}.{System.Environment.ProcessId}.tmp");
        // UTF-8 without a byte-order mark: some CI report readers take a BOM for content before the XML declaration.
        var settings = new System.Xml.XmlWriterSettings { Encoding = new System.Text.UTF8Encoding(false), Indent = true };
        using (var writer = System.Xml.XmlWriter.Create(temp, settings)) Build(cases).Save(writer);
        File.Move(temp, full, overwrite: true);
    }
}
