// The JSON shape of a fix body as stored in revisions.body, after sanitising.
export type BodyAttrValue = string | number;

export interface BodyMark {
  type: string;
  attrs?: Record<string, BodyAttrValue>;
}

export interface BodyNode {
  type: string;
  attrs?: Record<string, BodyAttrValue>;
  content?: BodyNode[];
  marks?: BodyMark[];
  text?: string;
}

export interface BodyDoc extends BodyNode {
  type: 'doc';
  content: BodyNode[];
}
