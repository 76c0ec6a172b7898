using System.Xml;
using System.Xml.Linq;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>Parses report HTML and chart SVG as XML, the strict check that they are well-formed.</summary>
internal static class Markup
{
    public static XDocument Parse(string markup)
    {
        var settings = new XmlReaderSettings { DtdProcessing = DtdProcessing.Ignore, XmlResolver = null };
        using var reader = XmlReader.Create(new StringReader(markup), settings);
        return XDocument.Load(reader);
    }

    /// <summary>Every element with the given local name, whatever its namespace.</summary>
    public static IEnumerable<XElement> Elements(XDocument document, string localName) =>
        document.Descendants().Where(element => element.Name.LocalName == localName);

    /// <summary>Text content of every SVG/HTML text-bearing element with the given local name.</summary>
    public static List<string> Texts(XDocument document, string localName) =>
        Elements(document, localName).Select(element => string.Concat(element.Nodes().OfType<XText>().Select(text => text.Value))).ToList();
}
